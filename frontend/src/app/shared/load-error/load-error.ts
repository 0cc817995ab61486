import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** What a page shows instead of its data when loading failed: the reason and a way to ask again. */
@Component({
  selector: 'rm-load-error',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div class="rm-state rm-state-error" role="alert">
      <mat-icon aria-hidden="true">cloud_off</mat-icon>
      <p>{{ message() }}</p>
      <button mat-stroked-button type="button" (click)="retry.emit()">Try again</button>
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadError {
  readonly message = input.required<string>();
  readonly retry = output<void>();
}

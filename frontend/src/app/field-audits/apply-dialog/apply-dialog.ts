import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import type { ApplyZoneTestInput, ZoneTestDto } from '@shared/field-audits/field-audit-dto';
import { slopeBand } from '@shared/field-audits/audit-schedule';

/** Asks which audit results to write into the hydrozone; nothing is written without this confirmation. */
@Component({
  selector: 'rm-apply-dialog',
  imports: [DecimalPipe, FormsModule, MatButtonModule, MatCheckboxModule, MatDialogModule],
  template: `
    <h2 mat-dialog-title>Write results into "{{ test.hydrozoneName }}"?</h2>
    <mat-dialog-content>
      <p>The budget and run-time advice of the hydrozone will use what you tick.</p>
      <mat-checkbox [(ngModel)]="choice.efficiency">
        Efficiency {{ test.results!.auditedEfficiency | number: '1.2-2' }} (1 ÷ the scheduling multiplier)
      </mat-checkbox>
      <mat-checkbox [(ngModel)]="choice.flow">
        Flow {{ test.results!.equivalentFlowGpm | number: '1.1-1' }} gpm (gives the measured
        {{ test.results!.prInPerHour | number: '1.2-2' }} in/h over the zone)
      </mat-checkbox>
      @if (test.soilIntakeInPerHour !== null) {
        <mat-checkbox [(ngModel)]="choice.soilIntake">
          Soil intake {{ intake | number: '1.2-2' }} in/h{{ test.slopePercent !== null ? ' (after the slope)' : '' }}
        </mat-checkbox>
      }
      <p class="note">
        A measured efficiency below the method's default raises this zone's monthly budget; MWELO allowances keep the
        ordinance's 0.75 and 0.81.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="null">Cancel</button>
      <button
        mat-flat-button
        type="button"
        [disabled]="!choice.efficiency && !choice.flow && !choice.soilIntake"
        [mat-dialog-close]="choice"
      >
        Write to hydrozone
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    mat-checkbox {
      display: block;
    }
    .note {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApplyDialog {
  protected readonly test = inject<ZoneTestDto>(MAT_DIALOG_DATA);
  protected readonly choice: ApplyZoneTestInput = { efficiency: true, flow: true, soilIntake: false };
  protected readonly intake =
    (this.test.soilIntakeInPerHour ?? 0) *
    (this.test.slopePercent !== null ? slopeBand(this.test.slopePercent).factor : 1);
}

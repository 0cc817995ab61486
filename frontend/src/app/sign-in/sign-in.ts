import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router } from '@angular/router';
import { AuthStore } from '../core/auth/auth-store';
import { describeApiError } from '../core/http/api-error';
import { LogoMark } from '../core/shell/logo-mark';

/** Only same-app paths, so a crafted link cannot bounce the user to another site after sign-in. */
function safeReturnUrl(url: string | undefined): string {
  return url && url.startsWith('/') && !url.startsWith('//') && !url.startsWith('/sign-in') ? url : '/portfolio';
}

@Component({
  selector: 'rm-sign-in',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    LogoMark,
  ],
  templateUrl: './sign-in.html',
  styleUrl: '../core/auth/auth-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);

  /** From the query string (`?returnUrl=`), bound by the router. */
  readonly returnUrl = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });
  protected readonly pending = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly passwordVisible = signal(false);

  protected togglePasswordVisibility(): void {
    this.passwordVisible.update((visible) => !visible);
  }

  protected async signIn(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.pending.set(true);
    this.error.set(null);
    const { email, password } = this.form.getRawValue();
    try {
      await this.auth.signIn(email.trim(), password);
      await this.router.navigateByUrl(safeReturnUrl(this.returnUrl()));
    } catch (err) {
      const problem = describeApiError(err);
      // Other messages (e.g. 429, which says how long to wait) are shown as the server sent them.
      this.error.set(problem.status === 401 ? 'The e-mail address or password is not correct.' : problem.message);
      this.form.controls.password.reset();
    } finally {
      this.pending.set(false);
    }
  }
}

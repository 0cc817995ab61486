import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import {
  type AbstractControl,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  type ValidationErrors,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { PASSWORD_MIN_LENGTH } from '@shared/users/user';
import { firstValueFrom } from 'rxjs';
import { AuthApi } from '../../core/auth/auth-api';
import { AuthStore } from '../../core/auth/auth-store';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { LogoMark } from '../../core/shell/logo-mark';

function passwordsMatch(group: AbstractControl): ValidationErrors | null {
  const { password, confirmation } = group.value as { password: string; confirmation: string };
  return confirmation && password !== confirmation ? { mismatch: true } : null;
}

/** Where an e-mailed link lands: accept an invitation or reset a password, by choosing a new password. */
@Component({
  selector: 'rm-set-password',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    LogoMark,
  ],
  templateUrl: './set-password.html',
  styleUrl: '../../core/auth/auth-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetPassword {
  private readonly api = inject(AuthApi);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);

  /** `?token=` from the e-mailed link. */
  readonly token = input<string>();
  /** From the route's data: which link this page was opened from. */
  readonly purpose = input<'invite' | 'reset'>('reset');

  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly form = inject(NonNullableFormBuilder).group(
    {
      password: ['', [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH), Validators.maxLength(200)]],
      confirmation: ['', Validators.required],
    },
    { validators: passwordsMatch },
  );

  protected readonly link = rxResource({
    params: () => this.token() || undefined,
    stream: ({ params }) => this.api.token(params),
  });
  protected readonly info = computed(() => (this.link.hasValue() ? this.link.value() : undefined));
  protected readonly heading = computed(() =>
    (this.info()?.purpose ?? this.purpose()) === 'invite' ? 'Welcome to Rillmark' : 'Choose a new password',
  );
  protected readonly linkError = computed(() => {
    if (!this.token()) return 'This link is incomplete. Open it again from the e-mail, or ask for a new one.';
    const error = this.link.error();
    if (!error) return null;
    const problem = describeApiError(error);
    return problem.status === 404
      ? 'This link has expired or has already been used. Ask your administrator to send a new one.'
      : problem.message;
  });

  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly done = signal(false);

  protected retry(): void {
    this.link.reload();
  }

  protected async setPassword(): Promise<void> {
    const info = this.info();
    const token = this.token();
    if (!info || !token) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { password } = this.form.getRawValue();
    this.saving.set(true);
    this.error.set(null);
    try {
      if (info.purpose === 'invite') {
        // Accepting an invitation signs the person in straight away.
        this.auth.adopt(await firstValueFrom(this.api.acceptInvite(token, password)));
        await this.router.navigate(['/sites']);
      } else {
        await firstValueFrom(this.api.resetPassword(token, password), { defaultValue: undefined });
        this.done.set(true);
      }
    } catch (err) {
      const problem = describeApiError(err, 'The password could not be saved.');
      const unmatched = applyFieldErrors(this.form, problem.fields);
      this.error.set(
        problem.status === 404
          ? 'This link has expired or has already been used. Ask your administrator to send a new one.'
          : [problem.message, ...unmatched].join(' '),
      );
    } finally {
      this.saving.set(false);
    }
  }
}

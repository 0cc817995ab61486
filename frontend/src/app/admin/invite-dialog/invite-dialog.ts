import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ROLE_LABELS, ROLES, type Role } from '@shared/auth/roles';
import type { OrgUserDto } from '@shared/users/user';
import { firstValueFrom } from 'rxjs';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { UsersApi } from '../users-api';

/** Invites a person into the admin's organisation; closes with the new user once the e-mail is on its way. */
@Component({
  selector: 'rm-invite-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
  ],
  templateUrl: './invite-dialog.html',
  styleUrl: './invite-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteDialog {
  private readonly api = inject(UsersApi);
  private readonly ref = inject<MatDialogRef<InviteDialog, OrgUserDto>>(MatDialogRef);

  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
    displayName: ['', [Validators.required, Validators.maxLength(120)]],
    role: ['contractor' as Role, Validators.required],
  });
  protected readonly sending = signal(false);
  protected readonly error = signal<string | null>(null);

  protected async sendInvitation(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    this.sending.set(true);
    this.error.set(null);
    try {
      const user = await firstValueFrom(
        this.api.invite({ ...value, email: value.email.trim(), displayName: value.displayName.trim() }),
      );
      this.ref.close(user);
    } catch (err) {
      const problem = describeApiError(err, 'The invitation could not be sent.');
      const unmatched = applyFieldErrors(this.form, problem.fields);
      this.error.set([problem.message, ...unmatched].join(' '));
    } finally {
      this.sending.set(false);
    }
  }
}

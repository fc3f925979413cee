import {
  ChangeDetectionStrategy,
  Component,
  type ElementRef,
  afterNextRender,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { type AbstractControl, FormBuilder, ReactiveFormsModule } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router } from '@angular/router';
import { signInSchema } from '../../../../../shared/schemas/session';
import { type ApiFailure, toApiFailure } from '../../core/api-failure';
import { Session } from '../../core/session';
import { zodValidator } from '../../core/zod-validator';
import { BrandMark } from '../../shared/brand-mark';

type CredentialField = 'email' | 'password';

@Component({
  selector: 'app-sign-in-page',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCardModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressSpinnerModule,
    BrandMark,
  ],
  templateUrl: './sign-in-page.html',
  styleUrl: './sign-in-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  /** Where the user was going before being sent here (query parameter set by the auth guard). */
  readonly next = input<string>();
  /** Why the user was sent here: `expired` when the session ended under them. */
  readonly reason = input<string>();
  private readonly emailInput = viewChild.required<ElementRef<HTMLInputElement>>('emailInput');
  private readonly passwordInput = viewChild.required<ElementRef<HTMLInputElement>>('passwordInput');

  protected readonly form = inject(FormBuilder).nonNullable.group({
    email: ['', zodValidator(signInSchema.shape.email)],
    password: ['', zodValidator(signInSchema.shape.password)],
  });
  /** Field errors show once a field was left or the form was sent (submit marks all touched), not before. */
  protected readonly touchedFields: ErrorStateMatcher = { isErrorState: (control) => !!control?.invalid && control.touched };
  protected readonly pending = signal(false);
  protected readonly passwordShown = signal(false);
  private readonly failure = signal<string | null>(null);
  protected readonly alert = computed(() => this.failure() ?? this.session.problem());
  protected readonly notice = computed(() =>
    !this.alert() && this.reason() === 'expired' ? 'Your session has ended. Sign in again to carry on.' : null,
  );

  constructor() {
    afterNextRender(() => this.emailInput().nativeElement.focus());
  }

  protected async submit(): Promise<void> {
    if (this.pending()) return;
    this.failure.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.focus(this.form.controls.email.invalid ? 'email' : 'password');
      return;
    }
    this.pending.set(true);
    try {
      await this.session.signIn(this.form.getRawValue());
      await this.router.navigateByUrl(this.destination());
    } catch (err) {
      this.show(toApiFailure(err));
    } finally {
      this.pending.set(false);
    }
  }

  /** The sentence under a field: the server's verdict if it gave one, else the shared schema's. */
  protected fieldError(control: AbstractControl): string {
    const errors = control.errors ?? {};
    return String(errors['server'] ?? errors['schema'] ?? '');
  }

  protected togglePassword(): void {
    this.passwordShown.update((shown) => !shown);
  }

  private show(failure: ApiFailure): void {
    for (const [field, message] of Object.entries(failure.fields)) {
      const control = this.form.get(field);
      control?.setErrors({ server: message });
      control?.markAsTouched();
    }
    this.failure.set(signInFailureMessage(failure));
    if (failure.code === 'bad_credentials') {
      this.form.controls.password.reset();
      this.focus('password');
    }
  }

  private focus(field: CredentialField): void {
    const target = field === 'email' ? this.emailInput() : this.passwordInput();
    target.nativeElement.focus();
  }

  private destination(): string {
    const next = this.next();
    return next && next.startsWith('/') && !next.startsWith('//') ? next : '/projects';
  }
}

function signInFailureMessage(failure: ApiFailure): string {
  switch (failure.code) {
    case 'bad_credentials':
      return 'That e-mail address and password do not match an account. Check both and try again.';
    case 'too_many_requests': {
      const minutes = failure.retryAfterSeconds ? Math.ceil(failure.retryAfterSeconds / 60) : null;
      const wait = minutes ? `${minutes} minute${minutes === 1 ? '' : 's'}` : 'a few minutes';
      return `Too many failed sign-in attempts. Wait ${wait}, then try again.`;
    }
    default:
      return failure.message;
  }
}

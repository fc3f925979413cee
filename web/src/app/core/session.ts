import { Injectable, computed, inject, signal } from '@angular/core';
import { type SessionUser, type SignIn, sessionStateSchema } from '../../../../shared/schemas/session';
import { ApiClient } from './api-client';
import { ApiFailure, toApiFailure } from './api-failure';

/** Who is signed in, as the server last told us. */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly api = inject(ApiClient);
  private readonly current = signal<SessionUser | null>(null);
  private readonly startProblem = signal<string | null>(null);

  readonly user = this.current.asReadonly();
  readonly signedIn = computed(() => this.current() !== null);
  /** Analysts and admins create and change work; viewers only read. */
  readonly canEdit = computed(() => {
    const role = this.current()?.role;
    return role === 'analyst' || role === 'admin';
  });
  readonly isAdmin = computed(() => this.current()?.role === 'admin');
  /** Why the session could not be read when the app started, if it could not; the sign-in page shows it. */
  readonly problem = this.startProblem.asReadonly();

  /**
   * Asks the server who we are. Besides the user, this answer sets the XSRF-TOKEN cookie that every later
   * write echoes, so it runs before the first screen. It never throws: a failure leaves us signed out.
   */
  async restore(): Promise<void> {
    try {
      const state = await this.api.get('/session', sessionStateSchema);
      this.current.set(state.user);
      this.startProblem.set(null);
    } catch (err) {
      this.current.set(null);
      this.startProblem.set(toApiFailure(err).message);
    }
  }

  async signIn(credentials: SignIn): Promise<SessionUser> {
    const state = await this.api.post('/session', credentials, sessionStateSchema);
    if (!state.user) {
      throw new ApiFailure(200, 'unexpected_answer', 'The server accepted the sign-in but sent no user. Try again.');
    }
    this.current.set(state.user);
    this.startProblem.set(null);
    return state.user;
  }

  /** Ends the session on the server; we count as signed out here even if the server could not be told. */
  async signOut(): Promise<void> {
    try {
      await this.api.delete('/session');
    } finally {
      this.current.set(null);
    }
  }

  /** Drops the user after the server said the session is gone (expired or ended elsewhere). */
  forget(): void {
    this.current.set(null);
  }
}

import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, firstValueFrom, finalize, map, tap } from 'rxjs';
import type { MeResponse, SignIn } from '../../../shared/api/auth';
import { apiPath } from '../api/api-path';

/** The signed-in user and their workspaces, as the server last told us (GET auth/me). */
@Injectable({ providedIn: 'root' })
export class AuthSession {
  private readonly http = inject(HttpClient);
  private readonly current = signal<MeResponse | null>(null);

  readonly me = this.current.asReadonly();
  readonly user = computed(() => this.current()?.user ?? null);
  readonly workspaces = computed(() => this.current()?.workspaces ?? []);
  readonly signedIn = computed(() => this.current() !== null);

  /** Asks the server who we are; called once before the first navigation. A 401 simply means signed out. */
  async restore(): Promise<void> {
    try {
      this.current.set(await firstValueFrom(this.http.get<MeResponse>(apiPath('auth', 'me'))));
    } catch {
      this.current.set(null);
    }
  }

  signIn(credentials: SignIn): Observable<MeResponse> {
    return this.http.post<MeResponse>(apiPath('auth', 'sign-in'), credentials).pipe(tap((me) => this.current.set(me)));
  }

  /** Takes over a session the server opened by another route (accepting an invitation). */
  adopt(me: MeResponse): void {
    this.current.set(me);
  }

  signOut(): Observable<void> {
    return this.http.post<unknown>(apiPath('auth', 'sign-out'), {}).pipe(
      map(() => undefined),
      // Forget locally even when the server call fails: the user asked to leave.
      finalize(() => this.current.set(null)),
    );
  }

  /** The server no longer accepts our session (a 401 elsewhere). */
  forget(): void {
    this.current.set(null);
  }
}

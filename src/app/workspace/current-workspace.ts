import { Injectable, computed, inject, signal } from '@angular/core';
import { AuthSession } from '../auth/auth-session';

const STORAGE_KEY = 'eclipta.workspace';

function readStored(): string | null {
  try {
    return localStorage.getItem(STORAGE_KEY);
  } catch {
    return null; // storage disabled: fall back to the first workspace
  }
}

/** The workspace the user is working in; remembered across visits, set from the URL when it names one. */
@Injectable({ providedIn: 'root' })
export class CurrentWorkspace {
  private readonly session = inject(AuthSession);
  private readonly chosenId = signal<string | null>(readStored());

  /** The chosen workspace when the user still belongs to it, otherwise their first one. */
  readonly membership = computed(() => {
    const list = this.session.workspaces();
    return list.find((w) => w.workspaceId === this.chosenId()) ?? list[0] ?? null;
  });
  readonly id = computed(() => this.membership()?.workspaceId ?? null);
  readonly role = computed(() => this.membership()?.role ?? null);

  select(workspaceId: string): void {
    this.chosenId.set(workspaceId);
    try {
      localStorage.setItem(STORAGE_KEY, workspaceId);
    } catch {
      // not remembered, still used for this visit
    }
  }
}

import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, of, tap } from 'rxjs';
import { Api } from './api';
import type { Role, Workspace } from './api-types';
import { Auth } from './auth';

const LAST_WORKSPACE = 'osm_workspace';

/** The signed-in user's workspaces and the one the navigation points at. */
@Injectable({ providedIn: 'root' })
export class WorkspaceContext {
  private readonly api = inject(Api);
  private readonly auth = inject(Auth);

  private readonly all = signal<Workspace[] | null>(null);
  private loadedFor: string | null = null;
  private readonly currentId = signal<string | null>(readLast());

  /** My workspaces (null until loaded). */
  readonly workspaces = this.all.asReadonly();
  /** The workspace the navigation points at. */
  readonly current = computed(() => {
    const id = this.currentId();
    return this.all()?.find((w) => String(w.id) === id) ?? null;
  });
  readonly role = computed<Role | null>(() => this.current()?.role ?? null);

  /** Loads the list once per signed-in user (again with `force`). */
  load(force = false): Observable<Workspace[]> {
    const who = this.auth.user() ? String(this.auth.user()!.id) : null;
    const cached = this.all();
    if (!force && cached && this.loadedFor === who) return of(cached);
    return this.api.workspaces().pipe(
      tap((list) => {
        this.all.set(list);
        this.loadedFor = who;
      }),
    );
  }

  select(id: number | string): void {
    this.currentId.set(String(id));
    try {
      localStorage.setItem(LAST_WORKSPACE, String(id));
    } catch {
      // no storage: the choice lasts for this page only
    }
  }

  /** After creating or joining one. */
  add(workspace: Workspace): void {
    this.all.update((list) => [...(list ?? []).filter((w) => String(w.id) !== String(workspace.id)), workspace]);
  }

  /** Forget everything (sign-out). */
  reset(): void {
    this.all.set(null);
    this.loadedFor = null;
  }
}

function readLast(): string | null {
  try {
    return localStorage.getItem(LAST_WORKSPACE);
  } catch {
    return null;
  }
}

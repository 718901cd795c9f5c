import { InjectionToken, inject } from '@angular/core';
import { map, of, type Observable } from 'rxjs';
import type { BufferValues, LibraryItem, WallValues } from '../../../../shared/api';
import { Api } from '../../core/api';
import { WorkspaceContext } from '../../core/workspace-context';

/** A buffer or wall material the Conditions tab can load (GET /api/workspaces/:wid/library). */
export interface LibraryChoice<T> {
  id: LibraryItem['id'];
  name: string;
  source: string;
  values: T;
}

export interface ConditionsLibrary {
  buffers(workspaceId: string | number | null): Observable<LibraryChoice<BufferValues>[]>;
  walls(workspaceId: string | number | null): Observable<LibraryChoice<WallValues>[]>;
}

function workspaceOf(given: string | number | null, context: WorkspaceContext): string | number | null {
  return given ?? context.current()?.id ?? null;
}

/**
 * The library as the Conditions tab reads it: the workspace's items of one kind, through the app's API client.
 * Tests and other hosts provide their own with `{ provide: CONDITIONS_LIBRARY, useValue: ... }`.
 */
export const CONDITIONS_LIBRARY = new InjectionToken<ConditionsLibrary>('Osmolane conditions library', {
  providedIn: 'root',
  factory: () => {
    const api = inject(Api);
    const context = inject(WorkspaceContext);
    const items = <T>(kind: LibraryItem['kind'], wid: string | number | null): Observable<LibraryChoice<T>[]> => {
      const id = workspaceOf(wid, context);
      if (id === null) return of([]);
      return api.library(id).pipe(
        map((list) =>
          list.filter((i) => i.kind === kind).map((i) => ({ id: i.id, name: i.name, source: i.source, values: i.values as T })),
        ),
      );
    };
    return {
      buffers: (wid) => items<BufferValues>('buffer', wid),
      walls: (wid) => items<WallValues>('wall', wid),
    };
  },
});

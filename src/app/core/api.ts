import { HttpClient, HttpContext, HttpContextToken, HttpEventType, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { DesignFileInfo, HealthResponse, ImportCreated, ImportPreview, MapQuantityName, RevisionCreated, RunCreated, RunExportFormat, SweepDetail, SweepEvent, SweepRequest, SweepSummary } from '../../../shared/api';
import type {
  ActivityItem,
  Comment,
  Design,
  DesignDocument,
  DesignSummary,
  Id,
  Invitation,
  InvitationPreview,
  LibraryItem,
  LibraryItemRequest,
  MailDetail,
  MailSummary,
  Member,
  Page,
  PageQuery,
  ReviewState,
  RevisionDetail,
  RevisionSummary,
  Role,
  RunDetail,
  RunListItem,
  RunSummary,
  SessionResponse,
  User,
  Workspace,
} from './api-types';
import { parseEventStream } from './event-stream';

/**
 * How the auth interceptor treats a request: `bearer` adds the access token and refreshes once on 401;
 * `public` sends no token and never refreshes (sign-in, refresh, reset, invitation look-up).
 */
export const AUTH_MODE = new HttpContextToken<'bearer' | 'public'>(() => 'bearer');

/** An id as the API gives it, or as a route parameter carries it. */
type Key = Id | string;

const PUBLIC = () => new HttpContext().set(AUTH_MODE, 'public');

function pageParams(query: PageQuery & Record<string, string | number | undefined>): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== '') params = params.set(key, String(value));
  }
  return params;
}

/** The multipart form of a drawing upload (the server reads `file`, `scale`, `name`, `preview`). */
function importForm(file: File, fields: { scale?: number; name?: string; preview?: string }): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) if (v !== undefined && v !== '') form.append(k, String(v));
  form.append('file', file, file.name);
  return form;
}

/** The one client of the Osmolane HTTP API (see shared/api.md and the API plan). Every call is an Observable. */
@Injectable({ providedIn: 'root' })
export class Api {
  private readonly http = inject(HttpClient);

  // ---- health
  health(): Observable<HealthResponse> {
    return this.http.get<HealthResponse>('/api/health', { context: PUBLIC() });
  }

  // ---- session
  signIn(email: string, password: string): Observable<SessionResponse> {
    return this.http.post<SessionResponse>('/api/auth/sign-in', { email, password }, { context: PUBLIC() });
  }
  /** Exchanges the `osm_refresh` cookie for a fresh access token. */
  refresh(): Observable<SessionResponse> {
    return this.http.post<SessionResponse>('/api/auth/refresh', {}, { context: PUBLIC() });
  }
  signOut(token: string | null): Observable<void> {
    const headers = token ? { Authorization: `Bearer ${token}` } : undefined;
    return this.http.post<void>('/api/auth/sign-out', {}, { context: PUBLIC(), headers });
  }
  me(): Observable<User> {
    return this.http.get<User>('/api/me');
  }
  changePassword(currentPassword: string, newPassword: string): Observable<void> {
    return this.http.post<void>('/api/auth/password', { currentPassword, newPassword });
  }
  requestReset(email: string): Observable<void> {
    return this.http.post<void>('/api/auth/reset-request', { email }, { context: PUBLIC() });
  }
  resetPassword(token: string, newPassword: string): Observable<void> {
    return this.http.post<void>('/api/auth/reset', { token, newPassword }, { context: PUBLIC() });
  }

  // ---- workspaces and members
  workspaces(): Observable<Workspace[]> {
    return this.http.get<Workspace[]>('/api/workspaces');
  }
  workspace(wid: Key): Observable<Workspace> {
    return this.http.get<Workspace>(`/api/workspaces/${wid}`);
  }
  createWorkspace(name: string): Observable<Workspace> {
    return this.http.post<Workspace>('/api/workspaces', { name });
  }
  members(wid: Key): Observable<Member[]> {
    return this.http.get<Member[]>(`/api/workspaces/${wid}/members`);
  }
  changeRole(wid: Key, userId: Key, role: Role): Observable<unknown> {
    return this.http.patch(`/api/workspaces/${wid}/members/${userId}`, { role });
  }
  removeMember(wid: Key, userId: Key): Observable<void> {
    return this.http.delete<void>(`/api/workspaces/${wid}/members/${userId}`);
  }
  invitations(wid: Key): Observable<Invitation[]> {
    return this.http.get<Invitation[]>(`/api/workspaces/${wid}/invitations`);
  }
  invite(wid: Key, email: string, role: Role): Observable<Invitation> {
    return this.http.post<Invitation>(`/api/workspaces/${wid}/invitations`, { email, role });
  }
  /** Withdraws a pending invitation (owner). */
  revokeInvitation(wid: Key, id: Key): Observable<void> {
    return this.http.delete<void>(`/api/workspaces/${wid}/invitations/${id}`);
  }
  invitation(token: string): Observable<InvitationPreview> {
    return this.http.get<InvitationPreview>(`/api/invitations/${encodeURIComponent(token)}`, { context: PUBLIC() });
  }
  /**
   * Accepts an invitation: with `name` and `password` it creates the account; with only `password` it joins an
   * existing account; with neither it joins as the signed-in user (the bearer token is sent).
   */
  acceptInvitation(token: string, body: { name?: string; password?: string }): Observable<SessionResponse> {
    // With a password the request stands on its own; without one it rides on the signed-in session.
    const context = body.password ? PUBLIC() : new HttpContext();
    return this.http.post<SessionResponse>(`/api/invitations/${encodeURIComponent(token)}/accept`, body, { context });
  }

  // ---- designs
  designs(wid: Key, query: PageQuery = {}): Observable<Page<DesignSummary>> {
    return this.http.get<Page<DesignSummary>>(`/api/workspaces/${wid}/designs`, { params: pageParams({ ...query }) });
  }
  createDesign(wid: Key, name: string, document: DesignDocument): Observable<Design> {
    return this.http.post<Design>(`/api/workspaces/${wid}/designs`, { name, document });
  }
  design(id: Key): Observable<Design> {
    return this.http.get<Design>(`/api/designs/${id}`);
  }
  /** Saves the draft when `version` is still current; answers 409 when someone saved first. */
  saveDesign(id: Key, document: DesignDocument, version: number, name?: string): Observable<Design> {
    return this.http.put<Design>(`/api/designs/${id}`, name === undefined ? { document, version } : { document, version, name });
  }
  setReviewState(id: Key, state: ReviewState): Observable<Design> {
    return this.http.post<Design>(`/api/designs/${id}/review`, { state });
  }

  // ---- revisions, runs, comments
  revisions(designId: Key): Observable<RevisionSummary[]> {
    return this.http.get<RevisionSummary[]>(`/api/designs/${designId}/revisions`);
  }
  saveRevision(designId: Key, note: string): Observable<RevisionCreated> {
    return this.http.post<RevisionCreated>(`/api/designs/${designId}/revisions`, { note });
  }
  revision(id: Key): Observable<RevisionDetail> {
    return this.http.get<RevisionDetail>(`/api/revisions/${id}`);
  }
  runs(revisionId: Key): Observable<RunListItem[]> {
    return this.http.get<RunListItem[]>(`/api/revisions/${revisionId}/runs`);
  }
  run(id: Key): Observable<RunDetail> {
    return this.http.get<RunDetail>(`/api/runs/${id}`);
  }
  saveRun(revisionId: Key, body: { settings: Record<string, unknown>; summary: RunSummary; fields?: string }): Observable<RunCreated> {
    return this.http.post<RunCreated>(`/api/revisions/${revisionId}/runs`, body);
  }
  runFields(id: Key): Observable<ArrayBuffer> {
    return this.http.get(`/api/runs/${id}/fields`, { responseType: 'arraybuffer' });
  }
  // ---- files: drawings in, outlines, run exports and reports out
  previewImport(wid: Key, file: File, scale?: number): Observable<ImportPreview> {
    return this.http.post<ImportPreview>(`/api/workspaces/${wid}/designs/import`, importForm(file, { scale, preview: '1' }));
  }
  importDesign(wid: Key, file: File, scale?: number, name?: string): Observable<ImportCreated> {
    return this.http.post<ImportCreated>(`/api/workspaces/${wid}/designs/import`, importForm(file, { scale, name }));
  }
  deleteDesign(id: Key): Observable<void> {
    return this.http.delete<void>(`/api/designs/${id}`);
  }
  designFiles(designId: Key): Observable<DesignFileInfo[]> {
    return this.http.get<DesignFileInfo[]>(`/api/designs/${designId}/files`);
  }
  outlineFile(designId: Key, format: 'svg' | 'dxf'): Observable<Blob> {
    return this.http.get(`/api/designs/${designId}/outline`, { params: { format }, responseType: 'blob' });
  }
  runExport(runId: Key, format: RunExportFormat, quantity: MapQuantityName = 'potential'): Observable<Blob> {
    return this.http.get(`/api/runs/${runId}/export`, { params: { format, quantity }, responseType: 'blob' });
  }
  runReport(runId: Key): Observable<Blob> {
    return this.http.get(`/api/runs/${runId}/report.pdf`, { responseType: 'blob' });
  }
  comments(revisionId: Key): Observable<Comment[]> {
    return this.http.get<Comment[]>(`/api/revisions/${revisionId}/comments`);
  }
  addComment(revisionId: Key, body: string, at: [number, number] | null): Observable<Comment> {
    return this.http.post<Comment>(`/api/revisions/${revisionId}/comments`, at ? { body, at } : { body });
  }

  // ---- sweeps
  startSweep(request: SweepRequest): Observable<SweepDetail> {
    return this.http.post<SweepDetail>('/api/sweeps', request);
  }
  sweeps(designId: Key): Observable<SweepSummary[]> {
    return this.http.get<SweepSummary[]>(`/api/designs/${designId}/sweeps`);
  }
  sweep(id: Key): Observable<SweepDetail> {
    return this.http.get<SweepDetail>(`/api/sweeps/${id}`);
  }
  cancelSweep(id: Key): Observable<SweepDetail> {
    return this.http.post<SweepDetail>(`/api/sweeps/${id}/cancel`, {});
  }
  /** Stores a solved point as a run of the sweep's revision (or answers the run it was opened as before). */
  openSweepPoint(id: Key, index: number): Observable<RunCreated> {
    return this.http.post<RunCreated>(`/api/sweeps/${id}/points/${index}/run`, {});
  }
  /**
   * A sweep's progress as server-sent events, read with fetch through the interceptors (so the bearer token is
   * sent and refreshed like any request's): the snapshot, then points and status; completes when the sweep ends.
   */
  sweepEvents(id: Key): Observable<SweepEvent> {
    return new Observable<SweepEvent>((subscriber) => {
      let read = 0;
      const take = (text: string) => {
        const { events, consumed } = parseEventStream(text.slice(read));
        read += consumed;
        for (const e of events) subscriber.next(JSON.parse(e.data) as SweepEvent);
      };
      const sub = this.http.get(`/api/sweeps/${id}/events`, { observe: 'events', reportProgress: true, responseType: 'text' }).subscribe({
        next: (event) => {
          if (event.type === HttpEventType.DownloadProgress) take(event.partialText ?? '');
          else if (event.type === HttpEventType.Response) take(event.body ?? '');
        },
        error: (err: unknown) => subscriber.error(err),
        complete: () => subscriber.complete(),
      });
      return () => sub.unsubscribe();
    });
  }

  // ---- library and activity
  library(wid: Key): Observable<LibraryItem[]> {
    return this.http.get<LibraryItem[]>(`/api/workspaces/${wid}/library`);
  }
  addLibraryItem(wid: Key, item: LibraryItemRequest): Observable<LibraryItem> {
    return this.http.post<LibraryItem>(`/api/workspaces/${wid}/library`, item);
  }
  updateLibraryItem(id: Key, item: LibraryItemRequest): Observable<LibraryItem> {
    return this.http.put<LibraryItem>(`/api/library/${id}`, item);
  }
  deleteLibraryItem(id: Key): Observable<void> {
    return this.http.delete<void>(`/api/library/${id}`);
  }
  activity(wid: Key, query: PageQuery & { designId?: Key } = {}): Observable<Page<ActivityItem>> {
    const { designId, ...rest } = query;
    return this.http.get<Page<ActivityItem>>(`/api/workspaces/${wid}/activity`, {
      params: pageParams({ ...rest, designId: designId === undefined ? undefined : String(designId) }),
    });
  }

  // ---- development mailbox (only when the server does not run in production)
  mailbox(): Observable<MailSummary[]> {
    return this.http.get<MailSummary[]>('/api/dev/mailbox');
  }
  mail(id: Key): Observable<MailDetail> {
    return this.http.get<MailDetail>(`/api/dev/mailbox/${id}`);
  }
}

import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter } from '@angular/router';
import { of } from 'rxjs';
import { Auth } from '../../core/auth';
import { WorkspaceContext } from '../../core/workspace-context';
import { ConfirmDialog, type ConfirmData } from '../../ui/confirm-dialog';
import { DesignList } from './design-list';

const page = {
  items: [
    { id: 4, name: 'T-mixer with back-pressure check', version: 2, reviewState: 'in review', updatedAt: '2026-12-01T10:00:00Z', updatedBy: { id: 3, name: 'Priya Raman' } },
    { id: 1, name: 'Cross injector, 50 um legs', version: 7, reviewState: 'draft', updatedAt: '2026-11-30T08:00:00Z', updatedBy: null },
  ],
  total: 31,
};

describe('DesignList', () => {
  let fixture: ComponentFixture<DesignList>;
  let http: HttpTestingController;

  async function setup(role: string) {
    await TestBed.configureTestingModule({ imports: [DesignList], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] }).compileComponents();
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(Auth).accept({ token: 't', user: { id: 2, email: 'j@example.test', name: 'J' } });
    const ctx = TestBed.inject(WorkspaceContext);
    ctx.load().subscribe();
    http.expectOne('/api/workspaces').flush([{ id: 1, name: 'Tidewater Assay Lab', role }]);
    ctx.select(1);
    fixture = TestBed.createComponent(DesignList);
    fixture.detectChanges();
    await settle();
  }

  async function settle() {
    await new Promise((r) => setTimeout(r, 0));
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('asks the server for one sorted page and shows names, review states and who changed them', async () => {
    await setup('editor');
    const req = http.expectOne((r) => r.url === '/api/workspaces/1/designs');
    expect(req.request.params.toString()).toBe('sort=updatedAt&order=desc&limit=25&offset=0');
    req.flush(page);
    await settle();
    const el: HTMLElement = fixture.nativeElement;
    const rows = el.querySelectorAll('[data-testid=design-row]');
    expect(rows).toHaveLength(2);
    expect(rows[0].textContent).toContain('T-mixer');
    expect(rows[0].textContent).toContain('in review');
    expect(rows[0].textContent).toContain('Priya Raman');
    expect(el.textContent).toContain('of 31');
    expect(el.querySelector('[data-testid=new-design]')).not.toBeNull();
  });

  it('filters on the server after typing stops, from the first page', async () => {
    await setup('editor');
    http.expectOne((r) => r.url === '/api/workspaces/1/designs').flush(page);
    const input = fixture.nativeElement.querySelector('[data-testid=design-filter]') as HTMLInputElement;
    input.value = 'cross';
    input.dispatchEvent(new Event('input'));
    await new Promise((r) => setTimeout(r, 300));
    await settle();
    const req = http.expectOne((r) => r.url === '/api/workspaces/1/designs');
    expect(req.request.params.get('q')).toBe('cross');
    expect(req.request.params.get('offset')).toBe('0');
    req.flush({ items: [page.items[1]], total: 1 });
  });

  it('sorts by name on the server when the header is clicked', async () => {
    await setup('editor');
    http.expectOne((r) => r.url === '/api/workspaces/1/designs').flush(page);
    await settle();
    (fixture.nativeElement.querySelector('.mat-column-name .mat-sort-header-container') as HTMLElement).click();
    await settle();
    const req = http.expectOne((r) => r.url === '/api/workspaces/1/designs');
    expect(req.request.params.get('sort')).toBe('name');
    expect(req.request.params.get('order')).toBe('asc');
    req.flush(page);
  });

  it('offers no "New design" to a viewer', async () => {
    await setup('viewer');
    http.expectOne((r) => r.url === '/api/workspaces/1/designs').flush(page);
    await settle();
    expect(fixture.nativeElement.querySelector('[data-testid=new-design]')).toBeNull();
  });

  describe('deleting a design', () => {
    const buttons = () => Array.from(fixture.nativeElement.querySelectorAll('[data-testid=delete-design]')) as HTMLButtonElement[];
    const designsRequest = () => http.expectOne((r) => r.url === '/api/workspaces/1/designs');

    /** The confirm dialog, answered with `answer`; returns the spy to read what it was asked. */
    function answerDialog(answer: boolean) {
      return jest.spyOn(TestBed.inject(MatDialog), 'open').mockReturnValue({ afterClosed: () => of(answer) } as never);
    }

    for (const role of ['viewer', 'reviewer']) {
      it(`offers no delete action to a ${role}`, async () => {
        await setup(role);
        designsRequest().flush(page);
        await settle();
        expect(fixture.nativeElement.querySelectorAll('[data-testid=design-row]')).toHaveLength(2);
        expect(buttons()).toHaveLength(0);
        expect(fixture.nativeElement.querySelector('th.mat-column-actions')).toBeNull();
      });
    }

    it('offers a labelled delete button on every row to editors and owners', async () => {
      for (const role of ['editor', 'owner']) {
        TestBed.resetTestingModule();
        await setup(role);
        designsRequest().flush(page);
        await settle();
        expect(buttons().map((b) => b.getAttribute('aria-label'))).toEqual([
          'Delete the design T-mixer with back-pressure check',
          'Delete the design Cross injector, 50 um legs',
        ]);
        // A native button: reachable with Tab, pressed with Enter or Space.
        expect(buttons().every((b) => b.tagName === 'BUTTON' && b.type === 'button' && !b.disabled)).toBe(true);
        http.verify();
      }
    });

    it('asks first, naming the design and what goes with it; on confirm deletes it, reads the page again and says so', async () => {
      await setup('editor');
      designsRequest().flush(page);
      await settle();
      const dialog = answerDialog(true);
      const snack = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
      buttons()[1].click();
      await settle();
      expect(dialog).toHaveBeenCalledTimes(1);
      expect(dialog.mock.calls[0][0]).toBe(ConfirmDialog);
      const data = dialog.mock.calls[0][1]!.data as ConfirmData;
      expect(data.title).toContain('Cross injector, 50 um legs');
      expect(data.message).toMatch(/revisions, runs, comments and files/);
      const del = http.expectOne('/api/designs/1');
      expect(del.request.method).toBe('DELETE');
      del.flush(null, { status: 204, statusText: 'No Content' });
      await settle();
      const again = designsRequest();
      expect(again.request.params.get('offset')).toBe('0');
      again.flush({ items: [page.items[0]], total: 30 });
      await settle();
      expect(fixture.nativeElement.querySelectorAll('[data-testid=design-row]')).toHaveLength(1);
      expect(snack).toHaveBeenCalledWith(expect.stringContaining('Cross injector, 50 um legs” was deleted'), undefined, expect.anything());
    });

    it('does nothing when the dialog is cancelled', async () => {
      await setup('owner');
      designsRequest().flush(page);
      await settle();
      const dialog = answerDialog(false);
      buttons()[0].click();
      await settle();
      expect(dialog).toHaveBeenCalledTimes(1);
      http.expectNone('/api/designs/4');
      http.expectNone((r) => r.url === '/api/workspaces/1/designs');
      http.verify();
    });

    it('shows the server’s message when the delete is refused, and keeps the list', async () => {
      await setup('editor');
      designsRequest().flush(page);
      await settle();
      answerDialog(true);
      const snack = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
      buttons()[0].click();
      await settle();
      http.expectOne('/api/designs/4').flush(
        { error: { code: 'conflict', message: 'A sweep of this design is still running; stop it first.' } },
        { status: 409, statusText: 'Conflict' },
      );
      await settle();
      expect(snack).toHaveBeenCalledWith(expect.stringContaining('A sweep of this design is still running; stop it first.'), 'Close', expect.anything());
      http.expectNone((r) => r.url === '/api/workspaces/1/designs');
      expect(fixture.nativeElement.querySelectorAll('[data-testid=design-row]')).toHaveLength(2);
      expect(buttons().every((b) => !b.disabled)).toBe(true);
    });
  });
});

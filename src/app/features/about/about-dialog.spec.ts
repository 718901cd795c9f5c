import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { SOLVER } from '../../core/solver-client';
import { AboutDialog } from './about-dialog';

describe('AboutDialog', () => {
  it('shows the server health and the solver worker state', async () => {
    await TestBed.configureTestingModule({
      imports: [AboutDialog],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: SOLVER, useValue: { hello: async () => ({ ready: true, at: 0 }) } }],
    }).compileComponents();
    const fixture = TestBed.createComponent(AboutDialog);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController).expectOne('/api/health').flush({ status: 'ok', version: '0.1.0', database: 'ok' });
    await new Promise((r) => setTimeout(r, 0));
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.querySelector('[data-testid=server-status]')?.textContent).toContain('ok, database ok, version 0.1.0');
    expect(el.querySelector('[data-testid=worker-status]')?.textContent).toContain('ready');
  });

  it('says when the worker fails to start', async () => {
    await TestBed.configureTestingModule({
      imports: [AboutDialog],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: SOLVER, useValue: { hello: async () => Promise.reject(new Error('no')) } }],
    }).compileComponents();
    const fixture = TestBed.createComponent(AboutDialog);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController).expectOne('/api/health').flush('down', { status: 502, statusText: 'Bad Gateway' });
    await new Promise((r) => setTimeout(r, 0));
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.querySelector('[data-testid=server-status]')?.textContent).toContain('not reachable');
    expect(el.querySelector('[data-testid=worker-status]')?.textContent).toContain('failed to start');
  });
});

import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { NewDesignDialog } from './new-design-dialog';

describe('NewDesignDialog', () => {
  it('creates the design from the chosen template under the given name', async () => {
    const close = jest.fn();
    await TestBed.configureTestingModule({
      imports: [NewDesignDialog],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MAT_DIALOG_DATA, useValue: { workspaceId: 1 } }, { provide: MatDialogRef, useValue: { close } }],
    }).compileComponents();
    const fixture = TestBed.createComponent(NewDesignDialog);
    fixture.detectChanges();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.querySelectorAll('osm-layout-preview')).toHaveLength(6);

    const name = el.querySelector('input[formcontrolname=name]') as HTMLInputElement;
    name.value = '  Sample loader B ';
    name.dispatchEvent(new Event('input'));
    (el.querySelector('[data-testid=template-serpentine] input') as HTMLInputElement).click();
    (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
    fixture.detectChanges();

    const req = TestBed.inject(HttpTestingController).expectOne('/api/workspaces/1/designs');
    expect(req.request.body.name).toBe('Sample loader B');
    expect(req.request.body.document.name).toBe('Sample loader B');
    expect(req.request.body.document.shapes.some((s: { type: string }) => s.type === 'sector')).toBe(true);
    req.flush({ id: 9, name: 'Sample loader B' });
    expect(close).toHaveBeenCalledWith({ id: 9, name: 'Sample loader B' });
  });

  it('needs a name', async () => {
    await TestBed.configureTestingModule({
      imports: [NewDesignDialog],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MAT_DIALOG_DATA, useValue: { workspaceId: 1 } }, { provide: MatDialogRef, useValue: { close: jest.fn() } }],
    }).compileComponents();
    const fixture = TestBed.createComponent(NewDesignDialog);
    fixture.detectChanges();
    (fixture.nativeElement.querySelector('button[type=submit]') as HTMLButtonElement).click();
    fixture.detectChanges();
    TestBed.inject(HttpTestingController).expectNone('/api/workspaces/1/designs');
    expect(fixture.nativeElement.textContent).toContain('Give the design a name.');
  });
});

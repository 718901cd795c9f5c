import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { SaveRevisionDialog } from './save-revision-dialog';

describe('SaveRevisionDialog', () => {
  async function open() {
    const close = jest.fn();
    await TestBed.configureTestingModule({
      imports: [SaveRevisionDialog],
      providers: [{ provide: MAT_DIALOG_DATA, useValue: { next: 3 } }, { provide: MatDialogRef, useValue: { close } }],
    }).compileComponents();
    const fixture = TestBed.createComponent(SaveRevisionDialog);
    fixture.detectChanges();
    return { fixture, close, el: fixture.nativeElement as HTMLElement };
  }

  it('answers the note, trimmed', async () => {
    const { el, close } = await open();
    expect(el.textContent).toContain('Save revision 3');
    const note = el.querySelector('[data-testid=revision-note]') as HTMLTextAreaElement;
    note.value = '  Wider waste leg ';
    note.dispatchEvent(new Event('input'));
    (el.querySelector('[data-testid=revision-save]') as HTMLButtonElement).click();
    expect(close).toHaveBeenCalledWith('Wider waste leg');
  });

  it('asks for a note first', async () => {
    const { fixture, el, close } = await open();
    (el.querySelector('[data-testid=revision-save]') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(close).not.toHaveBeenCalled();
    expect(el.textContent).toContain('Write a short note.');
  });
});

import { ChangeDetectionStrategy, Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { RowActions } from './row-actions';

// The labels a screen reader announces must name the row (WCAG 2.4.6, "Headings and Labels": a
// column of identical "Delete" buttons is ambiguous out of context).
@Component({
  imports: [RowActions],
  template: `
    <table>
      <tr>
        <td eclRowActions [name]="'mode ' + name()" [changeable]="changeable()" (edit)="said.push('edit')" (remove)="said.push('remove')">
          <button type="button">Environment</button>
        </td>
        <td eclRowActions [name]="'token CI'" [editLabel]="null" removeLabel="Revoke" (remove)="said.push('revoke')"></td>
      </tr>
    </table>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly name = signal('Sun-safe');
  readonly changeable = signal(true);
  readonly said: string[] = [];
}

async function render() {
  const fixture = TestBed.createComponent(Host);
  await fixture.whenStable();
  const cells = (): HTMLElement[] => Array.from(fixture.nativeElement.querySelectorAll('td'));
  const buttons = (cell: HTMLElement) => Array.from(cell.querySelectorAll('button')).map((b) => ({ text: b.textContent?.trim(), label: b.getAttribute('aria-label'), b }));
  return { fixture, cells, buttons };
}

describe('RowActions', () => {
  it('labels Edit and Delete with the row they act on, after the buttons placed inside', async () => {
    const { cells, buttons } = await render();
    expect(buttons(cells()[0]!).map(({ text, label }) => [text, label])).toEqual([
      ['Environment', null],
      ['Edit', 'Edit mode Sun-safe'],
      ['Delete', 'Delete mode Sun-safe'],
    ]);
    expect(buttons(cells()[1]!).map(({ text, label }) => [text, label])).toEqual([['Revoke', 'Revoke token CI']]);
  });

  it('tells its row which button was pressed', async () => {
    const { fixture, cells, buttons } = await render();
    const [, edit, remove] = buttons(cells()[0]!);
    edit!.b.click();
    remove!.b.click();
    buttons(cells()[1]!)[0]!.b.click();
    expect(fixture.componentInstance.said).toEqual(['edit', 'remove', 'revoke']);
  });

  it('keeps only the buttons placed inside for a reader, and follows a renamed row', async () => {
    const { fixture, cells, buttons } = await render();
    fixture.componentInstance.changeable.set(false);
    fixture.componentInstance.name.set('Nadir');
    await fixture.whenStable();
    expect(buttons(cells()[0]!).map(({ text }) => text)).toEqual(['Environment']);
    fixture.componentInstance.changeable.set(true);
    await fixture.whenStable();
    expect(buttons(cells()[0]!).map(({ label }) => label)).toContain('Delete mode Nadir');
  });
});

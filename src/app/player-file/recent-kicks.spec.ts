import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { PlayerKick } from '../../../shared/schemas/analysis';
import type { Outcome } from '../../../shared/schemas/sync';
import { kick } from '../core/analysis/spec-fixtures';
import { RecentKicks } from './recent-kicks';

/** 23 kicks: carries 20.0, 20.5, … (kick 0 has none), outcomes cycling, two techniques. */
function kicks(): PlayerKick[] {
  const outcomes: Outcome[] = ['on_target', 'short', 'long', 'left'];
  return Array.from({ length: 23 }, (_, i) =>
    kick(i, i % 5 === 0 ? 'driven' : 'lofted', outcomes[i % 4]!, i === 0 ? null : 20 + i / 2),
  ).reverse();
}

describe('RecentKicks', () => {
  let fixture: ComponentFixture<RecentKicks>;
  let loader: HarnessLoader;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection()] });
    fixture = TestBed.createComponent(RecentKicks);
    fixture.componentRef.setInput('kicks', kicks());
    fixture.componentRef.setInput('total', 40);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  async function column(name: string): Promise<string[]> {
    const table = await loader.getHarness(MatTableHarness);
    return (await table.getCellTextByColumnName())[name]?.text ?? [];
  }

  it('shows the newest kicks ten to a page and pages through the rest', async () => {
    const table = await loader.getHarness(MatTableHarness);
    expect((await table.getRows()).length).toBe(10);
    const paginator = await loader.getHarness(MatPaginatorHarness);
    expect(await paginator.getRangeLabel()).toBe('1 – 10 of 23');
    await paginator.goToNextPage();
    await paginator.goToNextPage();
    expect((await table.getRows()).length).toBe(3);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Showing the latest 23 of 40 kicks.');
  });

  it('sorts by carry, kicks without a carry last when descending', async () => {
    const sort = await loader.getHarness(MatSortHarness);
    const [carry] = await sort.getSortHeaders({ label: 'Carry' });
    await carry!.click();
    expect(await carry!.getSortDirection()).toBe('asc');
    expect((await column('carry')).slice(0, 3)).toEqual(['–', '20.5 m', '21.0 m']);
    await carry!.click();
    expect(await carry!.getSortDirection()).toBe('desc');
    expect((await column('carry')).slice(0, 2)).toEqual(['31.0 m', '30.5 m']);
  });

  it('sorts by technique alphabetically', async () => {
    const sort = await loader.getHarness(MatSortHarness);
    const [technique] = await sort.getSortHeaders({ label: 'Technique' });
    await technique!.click();
    const first = await column('technique');
    expect(first.slice(0, 5)).toEqual(['Driven', 'Driven', 'Driven', 'Driven', 'Driven']);
    expect(first[5]).toBe('Lofted');
  });

  it('filters by any word shown and says when nothing matches', async () => {
    const filter = await loader.getHarness(MatInputHarness.with({ placeholder: 'e.g. lofted, short, Tue' }));
    await filter.setValue('short');
    const paginator = await loader.getHarness(MatPaginatorHarness);
    // Kicks 1, 5, 9, 13, 17, 21 are "short".
    expect(await paginator.getRangeLabel()).toBe('1 – 6 of 6');
    expect(new Set(await column('outcome'))).toEqual(new Set(['Short']));
    await filter.setValue('driven short');
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('No kicks match “driven short”.');
  });

  it('shows still-air carries when asked and says so in the header', async () => {
    fixture.componentRef.setInput('basis', 'still-air');
    await fixture.whenStable();
    const sort = await loader.getHarness(MatSortHarness);
    expect((await sort.getSortHeaders({ label: 'Still-air carry' })).length).toBe(1);
    // The newest kick (22) logged 31.0 m; normalised it is 1.5 m longer in the fixture.
    expect((await column('carry'))[0]).toBe('32.5 m');
  });
});

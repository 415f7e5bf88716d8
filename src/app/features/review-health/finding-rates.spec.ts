import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { PAIR_RATES_LISTED, type FindingRate } from '../../../../shared/schemas/review-health.schema';
import { FindingRates } from './finding-rates';

const rate = (i: number): FindingRate => ({
  checkerName: `Checker ${i}`,
  authorName: `Author ${i}`,
  checks: 10,
  checksWithFindings: 2,
  findings: 3,
});
let fixture: ComponentFixture<FindingRates>;
const text = () => (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');

async function show(rates: FindingRate[], total?: number): Promise<void> {
  fixture = TestBed.createComponent(FindingRates);
  fixture.componentRef.setInput('rates', rates);
  fixture.componentRef.setInput('byPair', true);
  fixture.componentRef.setInput('caption', 'Finding rates per author and checker');
  if (total !== undefined) fixture.componentRef.setInput('total', total);
  fixture.detectChanges();
  await fixture.whenStable();
}

describe('finding rates per author and checker', () => {
  it('when only some pairs are listed, then it says how many of all and that the CSV has every pair', async () => {
    await show([rate(1), rate(2)], 4603);
    expect(text()).toContain(`2 of 4,603 pairs listed: the ${PAIR_RATES_LISTED} with the most checks`);
    expect(text()).toContain('The CSV export has every pair.');
    expect((fixture.nativeElement as HTMLElement).querySelectorAll('tr.mat-mdc-row')).toHaveLength(2);
  });

  it('when every pair is listed, then no such sentence shows', async () => {
    await show([rate(1), rate(2)], 2);
    expect(text()).not.toContain('pairs listed');
    expect(text()).toContain('Author 1');
  });
});

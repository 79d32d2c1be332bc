import { describe, expect, it } from 'vitest';
import { deviationWords } from './deviation-words';

describe('deviationWords', () => {
  it('says above, with a plus sign and an up mark, beyond an 8 % threshold', () => {
    expect(deviationWords(12.34, 8)).toEqual({ figure: '+12.3 %', direction: 'above committed', beyond: true, mark: '▲' });
  });
  it('says below, with the figure’s own minus sign and a down mark, beyond the threshold', () => {
    expect(deviationWords(-9, 8)).toEqual({ figure: '-9.0 %', direction: 'below committed', beyond: true, mark: '▼' });
  });
  it('gives no mark within the threshold, and none at exactly the threshold (alerts fire above it)', () => {
    expect(deviationWords(8, 8)).toMatchObject({ beyond: false, mark: '', direction: 'above committed' });
    expect(deviationWords(-2.5, 8)).toMatchObject({ beyond: false, mark: '', direction: 'below committed' });
  });
  it('reads a deviation that shows as 0.0 % as on committed', () => {
    expect(deviationWords(0.04, 8)).toMatchObject({ figure: '+0.0 %', direction: 'on committed' });
  });
  it('has no words without a figure, and no threshold means never beyond', () => {
    expect(deviationWords(null, 8)).toEqual({ figure: '—', direction: '', beyond: false, mark: '' });
    expect(deviationWords(40, null)).toMatchObject({ beyond: false, mark: '' });
  });
});

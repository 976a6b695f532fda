import { describe, expect, it } from 'vitest';
import { defaultSeason } from './default-season';

describe('default melt season', () => {
  it('takes the latest full northern summer half-year inside the record', () => {
    expect(defaultSeason({ from: '2021-10-01', to: '2024-09-30' }, 33.9)).toEqual({ from: '2024-04-01', to: '2024-09-30' });
    expect(defaultSeason({ from: '2021-10-01', to: '2024-08-31' }, 33.9)).toEqual({ from: '2023-04-01', to: '2023-09-30' });
  });

  it('takes October to March in the southern hemisphere', () => {
    expect(defaultSeason({ from: '2021-01-01', to: '2023-06-30' }, -33)).toEqual({ from: '2022-10-01', to: '2023-03-31' });
  });

  it('falls back to the whole record when no full season fits', () => {
    expect(defaultSeason({ from: '2024-07-01', to: '2024-07-02' }, 33)).toEqual({ from: '2024-07-01', to: '2024-07-02' });
  });
});

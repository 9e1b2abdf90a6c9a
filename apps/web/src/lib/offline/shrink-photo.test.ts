import { describe, expect, it } from 'vitest';
import { PHOTO_LONG_SIDE_PX, shrunkSize } from './shrink-photo';

describe('photos shrunk on the phone', () => {
  it('brings the long side down to 2,000 px and keeps the shape', () => {
    expect(PHOTO_LONG_SIDE_PX).toBe(2000);
    expect(shrunkSize(4032, 3024)).toEqual({ width: 2000, height: 1500 });
    expect(shrunkSize(3024, 4032)).toEqual({ width: 1500, height: 2000 });
  });

  it('never enlarges a small photo', () => {
    expect(shrunkSize(800, 600)).toEqual({ width: 800, height: 600 });
    expect(shrunkSize(8, 8)).toEqual({ width: 8, height: 8 });
  });
});

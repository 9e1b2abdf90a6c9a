import { describe, expect, it } from 'vitest';
import { flushOrderFor, flushOrderRooms, isWholeFlushOrder } from './flush-order.ts';

// Furthest radiator from the rig first, working back towards it: common practice (no source).
describe('the flush order kept on the site', () => {
  const rooms = ['Lounge', 'Kitchen', 'Bedroom', 'Bedroom', 'Bathroom'];

  it('an order names every radiator once', () => {
    expect(isWholeFlushOrder([4, 3, 2, 1, 0], 5)).toBe(true);
    expect(isWholeFlushOrder([4, 3, 2, 1], 5)).toBe(false);
    expect(isWholeFlushOrder([4, 4, 2, 1, 0], 5)).toBe(false);
    expect(isWholeFlushOrder([5, 3, 2, 1, 0], 5)).toBe(false);
  });

  it('is kept as rooms and found again in the next survey, rooms of the same name in turn', () => {
    const kept = flushOrderRooms([4, 3, 2, 0, 1], rooms);
    expect(kept).toEqual(['Bathroom', 'Bedroom', 'Bedroom', 'Lounge', 'Kitchen']);
    expect(flushOrderFor(kept, rooms)).toEqual({ radiatorIndexes: [4, 2, 3, 0, 1], from: 'site' });
  });

  it('radiators the kept order does not know follow in survey order; with none kept, the survey order', () => {
    expect(flushOrderFor(['bathroom', 'Loft'], rooms)).toEqual({ radiatorIndexes: [4, 0, 1, 2, 3], from: 'site' });
    expect(flushOrderFor(null, rooms)).toEqual({ radiatorIndexes: [0, 1, 2, 3, 4], from: 'survey' });
  });
});

import { describe, expect, it } from 'vitest';
import { cautionTexts, havDay, jobSteps, readingFigures, stepCautions, waterTestFigures } from './job-sheet.ts';

describe('radiator readings on the sheet', () => {
  // EN 442 rates radiators at 75/65/20 °C, dT 50 K: a rated 1200 W radiator gives its rating there.
  it('uses flow and return when taken: 75/65 in a 20 °C room is the rating point', () => {
    const f = readingFigures({ topC: 74, bottomC: 66, flowC: 75, returnC: 65, roomC: 20 }, 1200, 10);
    expect(f).toMatchObject({
      deltaTK: 50,
      deltaTFrom: 'flow_return',
      outputWatts: 1200,
      coldBottom: false,
      differenceK: 8,
    });
  });

  // EN 442 factor at dT 30 K is (30/50)^1.3 = 0.5148: surfaces 55 and 45 in a 20 °C room give dT 30.
  it('falls back to the surface readings and the 20 °C rating room', () => {
    const f = readingFigures({ topC: 55, bottomC: 45 }, 1000, 10);
    expect(f.deltaTFrom).toBe('surfaces');
    expect(f.roomUsedC).toBe(20);
    expect(f.deltaTK).toBe(30);
    expect(f.outputWatts).toBe(515);
  });

  // A cold bottom is a top-to-bottom difference over the firm's threshold (common practice (no source)).
  it('flags a cold bottom past the firm threshold, and not at it', () => {
    expect(readingFigures({ topC: 65, bottomC: 42 }, null, 10)).toMatchObject({
      coldBottom: true,
      differenceK: 23,
      outputWatts: null,
    });
    expect(readingFigures({ topC: 60, bottomC: 50 }, null, 10).coldBottom).toBe(false);
    expect(readingFigures({ topC: 60, bottomC: 50 }, null, 8).coldBottom).toBe(true);
  });

  it('gives no output when the water is no warmer than the room', () => {
    expect(readingFigures({ topC: 18, bottomC: 16, roomC: 20 }, 1000, 10).outputWatts).toBe(0);
  });
});

describe("an engineer's vibration day (HSE points system: 2 x a^2 x hours)", () => {
  // HSE points system (2 x a^2 x hours): 10 m/s^2 for 30 minutes is 100 points; 5 m/s^2 for 3 hours is 150.
  it('adds the points of each agitation', () => {
    expect(havDay([{ magnitudeMs2: 10, minutes: 30 }]).points).toBe(100);
    expect(
      havDay([
        { magnitudeMs2: 5, minutes: 90 },
        { magnitudeMs2: 5, minutes: 90 },
      ]).points,
    ).toBe(150);
  });

  it('warns as the day nears the action value (100) and the limit (400)', () => {
    expect(havDay([{ magnitudeMs2: 10, minutes: 20 }]).level).toBe('low'); // 66.7 points
    expect(havDay([{ magnitudeMs2: 10, minutes: 25 }]).level).toBe('nearing_action'); // 83.3
    expect(havDay([{ magnitudeMs2: 10, minutes: 30 }]).level).toBe('above_action'); // 100, the action value itself
    expect(havDay([{ magnitudeMs2: 10, minutes: 100 }]).level).toBe('nearing_limit'); // 333.3
    expect(havDay([{ magnitudeMs2: 10, minutes: 121 }]).level).toBe('above_limit'); // 403.3
  });

  it('counts nothing for a tool with no magnitude set, and says the figure', () => {
    const day = havDay([{ magnitudeMs2: null, minutes: 300 }]);
    expect(day.points).toBe(0);
    expect(day.message).toContain('0 vibration points');
  });
});

describe('water tests on the sheet', () => {
  // BS 7593 guidance as commonly quoted (the standard's own text was not seen): within 10% of mains TDS, and clear.
  it('judges the flush only when both TDS readings are in, and needs clear water', () => {
    expect(waterTestFigures({ mainsTdsPpm: 180 }, null).flush).toBeNull();
    expect(waterTestFigures({ mainsTdsPpm: 180, systemTdsPpm: 195, waterClear: true }, null).flush).toEqual({
      complete: true,
      withinPercent: 8.3,
    });
    expect(waterTestFigures({ mainsTdsPpm: 180, systemTdsPpm: 195, waterClear: false }, null).flush?.complete).toBe(
      false,
    );
    expect(waterTestFigures({ mainsTdsPpm: 180, systemTdsPpm: 240, waterClear: true }, null).flush).toEqual({
      complete: false,
      withinPercent: 33.3,
    });
  });

  it("checks the inhibitor reading against the product's own range", () => {
    const range = { min: 100, max: 200, unit: 'ppm' };
    expect(waterTestFigures({ inhibitorReading: 150 }, range).inhibitor).toEqual({ result: 'pass', ...range });
    expect(waterTestFigures({ inhibitorReading: 80 }, range).inhibitor?.result).toBe('low');
    expect(waterTestFigures({ inhibitorReading: 150 }, null).inhibitor).toBeNull();
  });
});

describe('cautions on the sheet', () => {
  it('puts the electrical and gas cautions before isolating, chemicals before each dose, the drain before flushing', () => {
    expect(stepCautions.isolate_connect).toEqual(expect.arrayContaining(['electrical', 'gas_oil']));
    expect(stepCautions.dose_cleaner).toContain('chemicals');
    expect(stepCautions.dose_inhibitor).toContain('chemicals');
    expect(stepCautions.flush).toContain('drain');
    for (const step of Object.keys(stepCautions)) expect(jobSteps).toContain(step);
    for (const text of Object.values(cautionTexts)) expect(text.length).toBeGreaterThan(20);
  });
});

import { describe, expect, it } from 'vitest';
import { fuels } from './heat-exchanger.ts';
import { jobSteps } from './job-sheet.ts';
import { visitCautions, visitDosesProduct, visitSteps, type VisitShape } from './visit-steps.ts';

const keysOf = (shape: VisitShape) => visitSteps(shape).map((s) => s.step);
const allText = (shape: VisitShape) =>
  [
    ...visitSteps(shape).flatMap((s) => [s.label, ...s.cautions.map((c) => c.text)]),
    ...visitCautions(shape).map((c) => c.text),
  ].join(' ');

describe('visitSteps: the steps fit the system, the fuel and the visit', () => {
  it('open-vented full clean: the feed-and-expansion cistern is checked and cleaned, refilled and vented from; never "pressurise"', () => {
    // Open-vented systems fill and vent from the cistern and are never pressurised: common practice (no source).
    const shape = { systemType: 'open_vented', fuel: 'gas', visitKind: 'full_clean' } as const;
    expect(keysOf(shape)).toEqual([
      'isolate_connect',
      'check_cistern',
      'latch_zone_valves',
      'dose_cleaner',
      'circulate_hot',
      'agitate',
      'flush',
      'dose_inhibitor',
      'reinstate',
    ]);
    expect(keysOf(shape)).not.toContain('depressurise');
    expect(keysOf(shape)).not.toContain('check_expansion_vessel');
    const reinstate = visitSteps(shape).find((s) => s.step === 'reinstate')!;
    expect(reinstate.label).toMatch(/refill from the feed-and-expansion cistern, vent/);
    expect(allText(shape)).not.toMatch(/\bpressurise\b(?! it)/i);
    expect(allText(shape)).not.toMatch(/filling loop|expansion vessel/i);
    expect(reinstate.cautions.map((c) => c.key)).toEqual(['open_vented_no_pressure']);
  });

  it('sealed full clean: depressurise, check the expansion vessel, refill through the filling loop to the cold fill pressure', () => {
    // Cold fill pressure about 1 to 1.5 bar from the boiler's instructions: common practice (no source).
    const shape = { systemType: 'sealed', fuel: 'gas', visitKind: 'full_clean' } as const;
    const steps = visitSteps(shape);
    expect(keysOf(shape)).toEqual([
      'depressurise',
      'check_expansion_vessel',
      'isolate_connect',
      'latch_zone_valves',
      'dose_cleaner',
      'circulate_hot',
      'agitate',
      'flush',
      'dose_inhibitor',
      'reinstate',
    ]);
    expect(keysOf(shape)).not.toContain('check_cistern');
    expect(steps.find((s) => s.step === 'reinstate')!.label).toMatch(
      /filling loop to the cold fill pressure \(about 1 to 1\.5 bar/,
    );
    expect(allText(shape)).not.toMatch(/cistern/i);
  });

  it('both systems latch open motorised zone valves for the flush', () => {
    // Common practice (no source): a closed zone valve leaves its circuit unflushed.
    for (const systemType of ['open_vented', 'sealed'] as const) {
      const keys = keysOf({ systemType, fuel: 'gas', visitKind: 'full_clean' });
      expect(keys.indexOf('latch_zone_valves')).toBeLessThan(keys.indexOf('flush'));
    }
  });

  it('gas shows the Gas Safe Register caution; oil and other fuels the competent registered person caution, never the gas one', () => {
    // Gas: Gas Safety (Installation and Use) Regulations 1998, regulation 3 (the Gas Safe Register is the approved class of persons).
    // Oil and other fuels: competent person schemes under the Building Regulations 2010, Schedule 3.
    for (const systemType of ['open_vented', 'sealed'] as const) {
      for (const visitKind of ['full_clean', 'inhibitor_only'] as const) {
        const gas = allText({ systemType, fuel: 'gas', visitKind });
        expect(gas).toContain('Gas Safe Register');
        const oil = allText({ systemType, fuel: 'oil', visitKind });
        expect(oil).not.toMatch(/gas/i);
        expect(visitCautions({ systemType, fuel: 'oil', visitKind }).map((c) => c.key)).toContain('oil_competent');
        const other = allText({ systemType, fuel: 'other', visitKind });
        expect(other).not.toMatch(/gas/i);
        expect(visitCautions({ systemType, fuel: 'other', visitKind }).map((c) => c.key)).toContain(
          'other_fuel_competent',
        );
      }
    }
    const first = visitSteps({ systemType: 'open_vented', fuel: 'oil', visitKind: 'full_clean' })[0]!;
    expect(first.cautions.map((c) => c.key)).toEqual(['electrical', 'oil_competent', 'hot_water']);
  });

  it('an inhibitor-only visit: dose, circulate, test; no cleaner, agitation or flush', () => {
    // BS 7593 (as commonly quoted): inhibitor dosed, circulated, and its level tested.
    for (const systemType of ['open_vented', 'sealed'] as const) {
      const keys = keysOf({ systemType, fuel: 'oil', visitKind: 'inhibitor_only' });
      expect(keys).toEqual(['dose_inhibitor', 'circulate_inhibitor', 'test_water']);
      const cautions = visitCautions({ systemType, fuel: 'oil', visitKind: 'inhibitor_only' }).map((c) => c.key);
      expect(cautions).not.toContain('drain');
    }
    expect(allText({ systemType: 'open_vented', fuel: 'gas', visitKind: 'inhibitor_only' })).not.toMatch(
      /filling loop/,
    );
  });

  it('the pressure caution fits the system', () => {
    for (const fuel of fuels) {
      expect(visitCautions({ systemType: 'open_vented', fuel, visitKind: 'full_clean' }).map((c) => c.key)).toContain(
        'open_vented_no_pressure',
      );
      expect(
        visitCautions({ systemType: 'open_vented', fuel, visitKind: 'full_clean' }).map((c) => c.key),
      ).not.toContain('sealed_pressure');
      expect(visitCautions({ systemType: 'sealed', fuel, visitKind: 'full_clean' }).map((c) => c.key)).toContain(
        'sealed_pressure',
      );
    }
  });

  it('every step is a known step', () => {
    for (const systemType of ['open_vented', 'sealed'] as const)
      for (const fuel of fuels)
        for (const visitKind of ['full_clean', 'inhibitor_only'] as const)
          for (const s of visitSteps({ systemType, fuel, visitKind })) expect(jobSteps).toContain(s.step);
  });
});

describe('the products a visit doses', () => {
  // An inhibitor visit is dose, circulate and test: no cleaner (DEVELOPERS.md, Product rules).
  it('a full clean doses every product booked; an inhibitor visit only the inhibitor', () => {
    expect(visitDosesProduct('full_clean', 'cleaner')).toBe(true);
    expect(visitDosesProduct('full_clean', 'inhibitor')).toBe(true);
    expect(visitDosesProduct('inhibitor_only', 'cleaner')).toBe(false);
    expect(visitDosesProduct('inhibitor_only', 'descaler')).toBe(false);
    expect(visitDosesProduct('inhibitor_only', 'inhibitor')).toBe(true);
  });
});

import { panelTypes, type Survey } from '@heatfleet/domain';

export type PanelType = (typeof panelTypes)[number];
export type TubeSize = '8' | '10' | '15' | '22' | '28' | 'plastic';

/** What the form holds while typing: every number as the text in its box. */
export interface RadiatorDraft {
  key: number;
  room: string;
  panel: PanelType;
  heightMm: string;
  lengthMm: string;
  litres: string;
  /** The maker's output at dT 50 (EN 442), for the output figure on the job sheet. */
  ratedWatts: string;
  coldSpotNote: string;
}

export interface PipeRunDraft {
  key: number;
  tube: TubeSize;
  boreMm: string;
  lengthM: string;
}

export interface SurveyDraft {
  systemType: Survey['systemType'];
  boilerKind: Survey['boilerKind'];
  fuel: Survey['fuel'];
  heatExchangerLitres: string;
  cylinderCoilLitres: string;
  otherLitres: string;
  radiators: RadiatorDraft[];
  pipeRuns: PipeRunDraft[];
}

export const panelLabels: Record<PanelType, string> = {
  single: 'Single panel',
  single_fins: 'Single with fins',
  double: 'Double panel',
  double_fins: 'Double with fins',
  column: 'Column',
  towel_rail: 'Towel rail',
  other: 'Other',
};

export function panelLabel(panel: string): string {
  return panel in panelLabels ? panelLabels[panel as PanelType] : panel;
}

export const tubeLabels: Record<TubeSize, string> = {
  '8': 'Copper 8 mm',
  '10': 'Copper 10 mm',
  '15': 'Copper 15 mm',
  '22': 'Copper 22 mm',
  '28': 'Copper 28 mm',
  plastic: 'Plastic (give the bore)',
};

let nextKey = 1;
export function newRowKey(): number {
  return nextKey++;
}

export function emptyRadiator(): RadiatorDraft {
  return {
    key: newRowKey(),
    room: '',
    panel: 'single',
    heightMm: '',
    lengthMm: '',
    litres: '',
    ratedWatts: '',
    coldSpotNote: '',
  };
}

export function emptyPipeRun(): PipeRunDraft {
  return { key: newRowKey(), tube: '15', boreMm: '', lengthM: '' };
}

export function initialSurveyDraft(): SurveyDraft {
  return {
    systemType: 'sealed',
    boilerKind: 'combi',
    fuel: 'gas',
    // Empty: the firm's default for the boiler kind and fuel (the API fills it in the same way).
    heatExchangerLitres: '',
    cylinderCoilLitres: '',
    otherLitres: '',
    radiators: [],
    pipeRuns: [],
  };
}

/** A box left empty is "not given"; anything else goes to the schema as a number, so "abc" fails there in words. */
function numberOrNull(text: string): number | null {
  const trimmed = text.trim();
  return trimmed === '' ? null : Number(trimmed.replace(',', '.'));
}

/** The survey exactly as typed, for the schema to judge on submit. */
export function draftToSurveyInput(draft: SurveyDraft): unknown {
  return {
    systemType: draft.systemType,
    boilerKind: draft.boilerKind,
    fuel: draft.fuel,
    heatExchangerLitres: numberOrNull(draft.heatExchangerLitres),
    cylinderCoilLitres: numberOrNull(draft.cylinderCoilLitres),
    otherLitres: numberOrNull(draft.otherLitres),
    radiators: draft.radiators.map((r) => ({
      room: r.room,
      panel: r.panel,
      heightMm: numberOrNull(r.heightMm),
      lengthMm: numberOrNull(r.lengthMm),
      litres: numberOrNull(r.litres),
      ratedWatts: numberOrNull(r.ratedWatts),
      coldSpotNote: r.coldSpotNote,
    })),
    pipeRuns: draft.pipeRuns.map((p) => ({
      tube: p.tube,
      ...(p.tube === 'plastic' ? { boreMm: numberOrNull(p.boreMm) } : {}),
      lengthM: numberOrNull(p.lengthM) ?? 0,
    })),
  };
}

function usable(text: string, min: number, max: number): number | null {
  const n = numberOrNull(text);
  return n !== null && Number.isFinite(n) && n >= min && n <= max ? n : null;
}

/**
 * The survey as far as it can be read while the engineer is still typing: a half-typed or
 * out-of-range figure counts as not given, so the live panel never stalls on one bad box.
 */
export function draftToLiveSurvey(draft: SurveyDraft): Survey {
  return {
    systemType: draft.systemType,
    boilerKind: draft.boilerKind,
    fuel: draft.fuel,
    heatExchangerLitres: usable(draft.heatExchangerLitres, 0, 100),
    cylinderCoilLitres: usable(draft.cylinderCoilLitres, 0, 100),
    otherLitres: usable(draft.otherLitres, 0, 2000),
    radiators: draft.radiators.map((r, i) => ({
      room: r.room.trim() || `Radiator ${i + 1}`,
      panel: r.panel,
      heightMm: usable(r.heightMm, 100, 2500),
      lengthMm: usable(r.lengthMm, 100, 4000),
      litres: usable(r.litres, 0, 200),
      ratedWatts: usable(r.ratedWatts, 0, 20_000),
      coldSpotNote: null,
    })),
    pipeRuns: draft.pipeRuns.flatMap((p): Survey['pipeRuns'] => {
      const lengthM = usable(p.lengthM, 0, 2000);
      if (lengthM === null) return [];
      if (p.tube !== 'plastic') return [{ tube: p.tube, lengthM }];
      const boreMm = usable(p.boreMm, 5, 60);
      return boreMm === null ? [] : [{ tube: p.tube, boreMm, lengthM }];
    }),
  };
}

/** A radiator size to tap instead of typing: height x length in mm (a towel rail: height x width). */
export interface SizePreset {
  key: string;
  label: string;
  heightMm: number | null;
  lengthMm: number | null;
}

const size = (heightMm: number, lengthMm: number): SizePreset => ({
  key: `${heightMm}x${lengthMm}`,
  label: `${heightMm} × ${lengthMm}`,
  heightMm,
  lengthMm,
});
export const noSize: SizePreset = { key: 'none', label: 'No size', heightMm: null, lengthMm: null };
export const panelSizePresets: SizePreset[] = [
  size(600, 400),
  size(600, 600),
  size(600, 800),
  size(600, 1000),
  size(600, 1200),
  size(450, 1000),
  size(300, 1200),
  noSize,
];
export const towelRailSizePresets: SizePreset[] = [size(800, 500), size(1200, 500), size(1600, 500), noSize];

export function sizePresetsFor(panel: PanelType): SizePreset[] {
  return panel === 'towel_rail' ? towelRailSizePresets : panelSizePresets;
}

/**
 * `count` radiators of one kind and size, named "Double panel 3" and so on after those of that kind
 * already listed; the rooms can be named later, one by one.
 */
export function radiatorsByCount(
  existing: readonly RadiatorDraft[],
  panel: PanelType,
  count: number,
  preset: SizePreset,
): RadiatorDraft[] {
  const label = panelLabels[panel];
  const already = existing.filter((r) => r.panel === panel).length;
  return Array.from({ length: count }, (_, i) => ({
    ...emptyRadiator(),
    room: `${label} ${already + i + 1}`,
    panel,
    heightMm: preset.heightMm === null ? '' : String(preset.heightMm),
    lengthMm: preset.lengthMm === null ? '' : String(preset.lengthMm),
  }));
}

/** "10 double panel 600 × 1000, 6 single panel 600 × 800, 2 towel rail": the list in a line. */
export function radiatorCountLine(rows: readonly RadiatorDraft[]): string {
  const groups = new Map<string, number>();
  for (const r of rows) {
    const sized = r.heightMm && r.lengthMm ? ` ${r.heightMm} × ${r.lengthMm}` : '';
    const key = `${panelLabels[r.panel].toLowerCase()}${sized}`;
    groups.set(key, (groups.get(key) ?? 0) + 1);
  }
  return [...groups].map(([key, n]) => `${n} ${key}`).join(', ');
}

/** A saved survey back into the form's text boxes, to edit a booked job. */
export function surveyToDraft(survey: Survey): SurveyDraft {
  const text = (n: number | null | undefined) => (n == null ? '' : String(n));
  return {
    systemType: survey.systemType,
    boilerKind: survey.boilerKind,
    fuel: survey.fuel,
    heatExchangerLitres: text(survey.heatExchangerLitres),
    cylinderCoilLitres: text(survey.cylinderCoilLitres),
    otherLitres: text(survey.otherLitres),
    radiators: survey.radiators.map((r) => ({
      key: newRowKey(),
      room: r.room,
      panel: r.panel,
      heightMm: text(r.heightMm),
      lengthMm: text(r.lengthMm),
      litres: text(r.litres),
      ratedWatts: text(r.ratedWatts),
      coldSpotNote: r.coldSpotNote ?? '',
    })),
    pipeRuns: survey.pipeRuns.map((p) => ({
      key: newRowKey(),
      tube: p.tube,
      boreMm: text(p.boreMm),
      lengthM: text(p.lengthM),
    })),
  };
}

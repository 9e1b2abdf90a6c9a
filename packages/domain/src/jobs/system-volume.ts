/**
 * Copper tube to EN 1057, the sizes used for heating: outside diameter and wall thickness in mm.
 * Water content per metre = pi/4 x ID^2 / 1000 litres, with ID = OD - 2 x wall.
 */
export const copperTubes = {
  '8': { outsideMm: 8, wallMm: 0.6 },
  '10': { outsideMm: 10, wallMm: 0.7 },
  '15': { outsideMm: 15, wallMm: 0.7 },
  '22': { outsideMm: 22, wallMm: 0.9 },
  '28': { outsideMm: 28, wallMm: 0.9 },
} as const;
export type CopperTubeSize = keyof typeof copperTubes;

export function boreLitresPerMetre(insideDiameterMm: number): number {
  return ((Math.PI / 4) * insideDiameterMm ** 2) / 1000;
}

export function pipeWaterContentLitresPerMetre(tube: CopperTubeSize): number {
  const { outsideMm, wallMm } = copperTubes[tube];
  return boreLitresPerMetre(outsideMm - 2 * wallMm);
}

export type PanelType = 'single' | 'single_fins' | 'double' | 'double_fins' | 'column' | 'towel_rail' | 'other';

/**
 * Litres per metre of radiator length at 600 mm high, from memory (editable per firm): about 3 L/m
 * for a single panel and 6 L/m for a double; the others are estimates of the same kind.
 */
export const defaultRadiatorLitresPerMetreAt600: Record<PanelType, number> = {
  single: 3,
  single_fins: 3,
  double: 6,
  double_fins: 6,
  column: 8,
  towel_rail: 2,
  other: 4,
};

/** Content scales with height: a 300 mm panel holds about half a 600 mm one (from memory). */
export function radiatorLitres(
  panel: PanelType,
  heightMm: number,
  lengthMm: number,
  perMetreAt600 = defaultRadiatorLitresPerMetreAt600,
): number {
  return perMetreAt600[panel] * (lengthMm / 1000) * (heightMm / 600);
}

/** Single-panel equivalents: a double counts as two (common trade practice, no source). */
export function singlePanelEquivalents(panels: PanelType[]): number {
  return panels.reduce((n, p) => n + (p === 'double' || p === 'double_fins' ? 2 : 1), 0);
}

/** The quick estimate with no survey: about 10 L per single-panel equivalent, pipework included (common trade practice). */
export function quickEstimateLitres(panels: PanelType[]): number {
  return 10 * singlePanelEquivalents(panels);
}

export interface VolumeParts {
  radiatorsLitres: number;
  pipeworkLitres: number;
  heatExchangerLitres: number;
  cylinderCoilLitres: number;
  otherLitres: number;
}

export function systemVolumeLitres(parts: VolumeParts): number {
  return (
    parts.radiatorsLitres +
    parts.pipeworkLitres +
    parts.heatExchangerLitres +
    parts.cylinderCoilLitres +
    parts.otherLitres
  );
}

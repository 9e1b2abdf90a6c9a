/** Weights and Measures Act 1985, Schedule 1: 1 gallon = 4.54609 cubic decimetres, exactly. */
export const LITRES_PER_IMPERIAL_GALLON = 4.54609;

export function litresToImperialGallons(litres: number): number {
  return litres / LITRES_PER_IMPERIAL_GALLON;
}

export function imperialGallonsToLitres(gallons: number): number {
  return gallons * LITRES_PER_IMPERIAL_GALLON;
}

export type PackUnit = 'ml' | 'l';

/** Pack sizes are kept in whole millilitres so 500 ml and 0.5 L are the same pack. */
export function packSizeMl(size: number, unit: PackUnit): number {
  return Math.round(unit === 'l' ? size * 1000 : size);
}

export function formatPackSize(ml: number): string {
  return ml >= 1000 && ml % 100 === 0 ? `${ml / 1000} L` : `${ml} ml`;
}

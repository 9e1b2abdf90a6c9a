/**
 * EN 442 radiator output at another temperature difference: output = rated x (dT / 50)^n, with
 * dT = (flow + return) / 2 - room, rated at 75/65/20 (dT 50 K), n about 1.3 unless the radiator's own is known.
 */
export function meanWaterToRoomKelvin(flowC: number, returnC: number, roomC: number): number {
  return (flowC + returnC) / 2 - roomC;
}

export function radiatorOutputFactor(deltaTKelvin: number, exponent = 1.3): number {
  if (deltaTKelvin <= 0) return 0;
  return (deltaTKelvin / 50) ** exponent;
}

export function radiatorOutputWatts(ratedWattsAtDt50: number, deltaTKelvin: number, exponent = 1.3): number {
  return ratedWattsAtDt50 * radiatorOutputFactor(deltaTKelvin, exponent);
}

/** A cold bottom (sludge) when the top is warmer than the bottom by more than the firm's threshold (common practice). */
export function coldBottom(topC: number, bottomC: number, thresholdKelvin: number): boolean {
  return topC - bottomC > thresholdKelvin;
}

/**
 * Flush complete: system water TDS within 10% of mains TDS, measured before the inhibitor goes in,
 * and the water visibly clear (as BS 7593 guidance is commonly quoted).
 */
export function flushComplete(
  mainsTdsPpm: number,
  systemTdsPpm: number,
  waterClear: boolean,
): { complete: boolean; withinPercent: number } {
  const withinPercent = mainsTdsPpm > 0 ? (Math.abs(systemTdsPpm - mainsTdsPpm) / mainsTdsPpm) * 100 : Infinity;
  return { complete: waterClear && withinPercent <= 10, withinPercent };
}

export function inhibitorCheck(measured: number, range: { min: number; max: number }): 'pass' | 'low' | 'high' {
  if (measured < range.min) return 'low';
  if (measured > range.max) return 'high';
  return 'pass';
}

/**
 * Hand-arm vibration, HSE points system (Control of Vibration at Work Regulations 2005):
 * points = 2 x a^2 x hours; 100 points is the exposure action value (A(8) 2.5 m/s^2), 400 the limit value (5 m/s^2).
 */
export const HAV_ACTION_POINTS = 100;
export const HAV_LIMIT_POINTS = 400;

export function vibrationPoints(magnitudeMs2: number, hours: number): number {
  return 2 * magnitudeMs2 ** 2 * hours;
}

export function vibrationStatus(points: number): 'below_action' | 'above_action' | 'above_limit' {
  if (points > HAV_LIMIT_POINTS) return 'above_limit';
  if (points >= HAV_ACTION_POINTS) return 'above_action';
  return 'below_action';
}

/** 1 bar = 14.5038 psi (from memory; 100 kPa / 6.894757 kPa per psi). */
export const PSI_PER_BAR = 14.5038;

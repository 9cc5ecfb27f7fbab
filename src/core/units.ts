/**
 * Concentration units. Exposure limits in ppm are defined at 25 °C and 1 atm, so the
 * conversion uses the conventional molar volume 24.45 L/mol whatever the weather
 * (NIOSH Pocket Guide / ACGIH convention): mg/m³ = ppm · MW / 24.45.
 */
export const MOLAR_VOLUME_L = 24.45;

/** ppm (by volume) → mg/m³ for molecular weight `mw` (g/mol). */
export function ppmToMgM3(ppm: number, mw: number): number {
  return (ppm * mw) / MOLAR_VOLUME_L;
}

/** mg/m³ → ppm (by volume) for molecular weight `mw` (g/mol). */
export function mgM3ToPpm(mgM3: number, mw: number): number {
  return (mgM3 * MOLAR_VOLUME_L) / mw;
}

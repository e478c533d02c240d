/**
 * Octanol/water partition free energy from logP.
 *
 * ΔG_OW = ln(10) · R · T · logP, in kJ/mol, with R = 8.314462618 J mol⁻¹ K⁻¹ (CODATA 2018, exact since
 * the 2019 SI redefinition). Sign convention: positive means the solute prefers octanol (logP > 0), i.e.
 * ΔG_OW = G_water − G_octanol. At 298.15 K, logP = 1 gives 5.708 kJ/mol.
 */
export const GAS_CONSTANT = 8.314462618;
export const DEFAULT_TEMPERATURE = 298.15;

export function partitionFreeEnergy(logP: number, temperature = DEFAULT_TEMPERATURE): number {
  return (Math.LN10 * GAS_CONSTANT * temperature * logP) / 1000;
}

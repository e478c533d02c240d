/**
 * Octanol/water partition free energy from logP.
 *
 * ΔG_OW = ln(10) · R · T · logP, in kJ/mol, with R = 8.314462618 J mol⁻¹ K⁻¹ (CODATA 2018, exact since
 * the 2019 SI redefinition). Sign convention: positive means the solute prefers octanol (logP > 0), i.e.
 * ΔG_OW = G_water − G_octanol. At 298.15 K, logP = 1 gives 5.708 kJ/mol.
 *
 * logP (measured or estimated by Wildman–Crippen) is a 298 K quantity. ΔG at another temperature is
 * this formula with that T, i.e. it scales linearly with T and assumes logP itself does not change
 * (no enthalpy/entropy split is known for an estimate). A measured ΔG is read as ΔG at 298.15 K.
 */
export const GAS_CONSTANT = 8.314462618;
export const DEFAULT_TEMPERATURE = 298.15;

export function partitionFreeEnergy(logP: number, temperature = DEFAULT_TEMPERATURE): number {
  return (Math.LN10 * GAS_CONSTANT * temperature * logP) / 1000;
}

/** logP from a ΔG_OW given at `temperature` (the inverse of partitionFreeEnergy). */
export function logPFromFreeEnergy(deltaG: number, temperature = DEFAULT_TEMPERATURE): number {
  return (deltaG * 1000) / (Math.LN10 * GAS_CONSTANT * temperature);
}

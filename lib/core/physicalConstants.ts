// CODATA 2018 recommended values: E. Tiesinga, P. J. Mohr, D. B. Newell and B. N. Taylor,
// "CODATA recommended values of the fundamental physical constants: 2018",
// Rev. Mod. Phys. 93, 025010 (2021). h, c, k and N_A are exact in the 2019 SI.

/** Planck constant, J s (exact). */
export const planckJs = 6.62607015e-34;
/** Speed of light in vacuum, m/s (exact). */
export const speedOfLightMs = 299792458;
/** Boltzmann constant, J/K (exact). */
export const boltzmannJK = 1.380649e-23;
/** Avogadro constant, 1/mol (exact). */
export const avogadroPerMol = 6.02214076e23;
/** Atomic mass constant m_u, kg (CODATA 2018: 1.66053906660(50)e-27 kg). */
export const atomicMassUnitKg = 1.6605390666e-27;
/** Speed of light in cm/s, for the cgs intensity formulas. */
export const speedOfLightCmS = speedOfLightMs * 100;
/** Planck constant in erg s (cgs). */
export const planckErgS = planckJs * 1e7;
/** Second radiation constant c2 = hc/k in cm K (CODATA 2018: 1.438776877... cm K). */
export const secondRadiationConstantCmK = ((planckJs * speedOfLightMs) / boltzmannJK) * 100;
/** One debye in esu cm (statC cm): 1 D = 1e-18 esu cm by definition. */
export const debyeEsuCm = 1e-18;
/** Standard atmosphere, Pa (exact by definition). */
export const standardAtmospherePa = 101325;
/** Electron mass in u (CODATA 2018: 5.48579909065(16)e-4 u). */
export const electronMassU = 5.48579909065e-4;

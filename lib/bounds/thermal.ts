/** 10 log10(k_B T0 / 1 mW) with k_B = 1.380649e-23 J/K (SI 2019, exact) and T0 = 290 K (IEEE noise figure reference). */
export const THERMAL_DBM_PER_HZ = 10 * Math.log10((1.380649e-23 * 290) / 1e-3);

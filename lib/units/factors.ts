/**
 * Exact conversion factors, NIST SP 811 (2008) Appendix B.
 * Written as the double nearest the exact product of the definitions (1 in = 0.0254 m,
 * 1 lb = 0.45359237 kg, g_n = 9.80665 m/s²); multiplying those at run time lands 1 ulp off.
 */
export const MM_PER_IN = 25.4;
export const MM_PER_FT = 304.8;
export const UM_PER_MIL = 25.4;
/** 0.45359237 × 9.80665 */
export const N_PER_LBF = 4.4482216152605;
/** 4.4482216152605 × 0.3048 */
export const NM_PER_LBF_FT = 1.3558179483314004;
/** 4.4482216152605 × 0.0254 */
export const NM_PER_LBF_IN = 0.1129848290276167;
/** 4.4482216152605 / 0.0254² / 1000 */
export const KPA_PER_PSI = 6.894757293168361;
/** 1 kip = 1000 lbf */
export const KN_PER_KIP = 4.4482216152605;
export const KPA_PER_BAR = 100;
export const DEG_PER_RAD = 180 / Math.PI;
/** t(°C) = (t(°F) − 32)/1.8 */
export const F_PER_C = 1.8;
export const F_AT_0C = 32;
export const K_AT_0C = 273.15;

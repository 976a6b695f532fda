/**
 * Physical constants used across the engine, each with its source.
 */

/** Solar constant, W m⁻² (Kopp & Lean 2011, GRL 38 L01706). */
export const SOLAR_CONSTANT_WM2 = 1360.8;

/** Stefan–Boltzmann constant, W m⁻² K⁻⁴ (CODATA 2018). */
export const STEFAN_BOLTZMANN = 5.670374419e-8;

/** Latent heat of fusion of ice, J kg⁻¹ (Cuffey & Paterson 2010; common practice). */
export const LATENT_HEAT_FUSION = 3.34e5;

/** Latent heat of sublimation, J kg⁻¹ (common practice) [memory]. */
export const LATENT_HEAT_SUBLIMATION = 2.834e6;

/** Latent heat of vaporisation at 0 °C, J kg⁻¹ (common practice) [memory]. */
export const LATENT_HEAT_VAPORISATION = 2.501e6;

/** Specific heat of ice near 0 °C, J kg⁻¹ K⁻¹ (Cuffey & Paterson 2010) [memory]. */
export const SPECIFIC_HEAT_ICE = 2097;

/** Specific heat of liquid water, J kg⁻¹ K⁻¹ (common practice). */
export const SPECIFIC_HEAT_WATER = 4186;

/** Specific heat of dry air at constant pressure, J kg⁻¹ K⁻¹ (common practice). */
export const SPECIFIC_HEAT_AIR = 1005;

/** Gas constant of dry air, J kg⁻¹ K⁻¹ (common practice). */
export const GAS_CONSTANT_DRY_AIR = 287.05;

/** Ratio of the molar masses of water vapour and dry air (common practice). */
export const VAPOUR_MASS_RATIO = 0.622;

/** Density of ice, g cm⁻³, for specific surface area (Gardner & Sharp 2010). */
export const ICE_DENSITY_G_CM3 = 0.917;

/** Density of glacier ice, kg m⁻³ (Cuffey & Paterson 2010; common practice). */
export const ICE_DENSITY_KG_M3 = 917;

/** Thermal conductivity of ice near 0 °C, W m⁻¹ K⁻¹ (Cuffey & Paterson 2010) [memory]. */
export const ICE_CONDUCTIVITY = 2.1;

/** Acceleration due to gravity, m s⁻² (common practice). */
export const GRAVITY = 9.81;

/** von Kármán constant (common practice). */
export const VON_KARMAN = 0.4;

/** Height of the temperature, humidity and wind measurements the forcing stands for, m (screen height; assumption). */
export const MEASUREMENT_HEIGHT_M = 2;

/** 0 °C in kelvin. */
export const ZERO_CELSIUS_K = 273.15;

/** Sea-level standard pressure, Pa (ICAO standard atmosphere). */
export const SEA_LEVEL_PRESSURE_PA = 101325;

/** Seconds in one model step (one hour). */
export const SECONDS_PER_HOUR = 3600;

/** Outgoing longwave of a melting surface (emissivity 1 at 0 °C), W m⁻²: σ·273.15⁴ [computed]. */
export const MELTING_SURFACE_LONGWAVE_WM2 = STEFAN_BOLTZMANN * ZERO_CELSIUS_K ** 4;

export const DEG = Math.PI / 180;

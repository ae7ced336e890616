/** Density of fresh water used throughout the planner, kg/m³ (the round figure the Engineering ToolBox examples use; REFERENCE-VALUES 7.1, 7.2). */
export const FRESH_WATER_DENSITY_KG_PER_M3 = 1000;

/** Standard acceleration of gravity, m/s² (exact by definition: 3rd CGPM, 1901). The Engineering ToolBox example rounds it to 9.81. */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

export const JOULES_PER_KWH = 3.6e6;
export const DAYS_PER_YEAR = 365.25;

// Public API of the HV physics: pure functions, SI units in every name, no dependencies.
export { HvInputError } from './errors';
export * from './units';
export * from './energy';
export * from './discharge';
export * from './hazardous-live';
export * from './approach-boundaries';
export * from './multiplier';
export * from './breakdown';
export * from './rating-margin';
export * from './trade-facts';
export * from './hotsticks';
export * from './inspection-intervals';

export type { Marker, SourcedValue } from './data/types';
export { HAZARDOUS_LIVE_LEVELS } from './data/iec61010';
export { SAFE_RESIDUAL_VOLTAGE, FIVE_TIME_CONSTANTS } from './data/residual-voltage';
export { NFPA70E_DC_TABLE, NFPA70E_AC_TABLE, type ApproachBoundaryRow, type ApproachBoundaryTable } from './data/nfpa70e';
export { AIR } from './data/air';
export { HOT_STICK_TESTS, RETEST_INTERVALS } from './data/osha';
export * from './air-density';
export * from './ehd';
export * from './corona-fit';
export * from './bench-run';
export { EHD, AIR_GAS } from './data/ehd';

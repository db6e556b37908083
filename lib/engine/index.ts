// Public API of the feasibility engine: pure TypeScript, SI units inside, no I/O.
export { EngineInputError } from './errors';
export { ENGINE_VERSION } from './version';
export { SOURCES, sourcesFor, type Source, type SourceId, type Confidence } from './sources';
export {
  volumetricFlowLps,
  vNotchFlowLps,
  rectangularWeirFlowLps,
  floatFlowLps,
  V_NOTCH_MIN_HEAD_M,
  type VolumetricTrial,
  type RectangularWeirReading,
  type FloatReading,
} from './flow';
export {
  levelRun,
  levelRowsDropping,
  clinometerFallM,
  hoseLevelFallM,
  allowedMisclosureMm,
  altitudeFallM,
  barometricFallM,
  MISCLOSURE_MM_PER_ROOT_KM,
  type LevelRow,
  type LevelRunResult,
  type ClinometerLeg,
  type HoseLevelStep,
  type LevellingOrder,
} from './fall';
export {
  hazenWilliamsLossM,
  darcyWeisbachLossM,
  waveSpeedMps,
  joukowskySurgeM,
  pipeVelocityMps,
  frictionFactor,
  type HazenWilliamsInput,
  type DarcyWeisbachInput,
  type WaveSpeedInput,
  type JoukowskyInput,
} from './pipes';
export { velocityHeadM, pressureHeadM, headToKPa } from './heads';
export { waterDensityKgM3, waterViscosityPaS, G } from './physics';
export {
  ramEfficiency,
  ramDeliveryLpm,
  daubuissonEfficiency,
  rankineEfficiency,
  EFFICIENCY_CURVES,
  type EfficiencyCurveId,
  type EfficiencyCurve,
  type RamEfficiencyResult,
  type RamDeliveryInput,
  type RamTestReading,
} from './ram';
export { DEMAND_CATALOGUE, dailyDemandL, demandBreakdown, type DemandKind, type DemandLine, type DemandEntry } from './demand';
export { TANK_RULES, TANK_SIZES_L, tankSizeL, type TankRuleId } from './tank';
export {
  DRIVE_LENGTH_RULES,
  DRIVE_LD_BAND,
  RAM_SIZE_TABLE,
  driveLengthBandM,
  ramSizeForFlow,
  minimumDriveVelocityMps,
  type DriveLengthRuleId,
} from './drive-pipe';
export { PIPE_MATERIALS, NOMINAL_SIZES, boreMm, wallMm, type PipeMaterialId, type PipeMaterial, type PressureClass } from './materials';
export { screenSite, parseReadingsOrThrow } from './screen';
export { runMonteCarlo, type MonteCarloInput, type MonteCarloResult } from './monte-carlo';
export { mulberry32, normalSampler, quantileSorted } from './random';
export { judge, MIN_FALL_M, MAX_LIFT_RATIO, WARN_LIFT_RATIO, MIN_SUPPLY_MULTIPLE, MIN_DELIVERY_HEAD_M, MIN_PROBABILITY_MEETS } from './verdict';
export type { Screening, Figure, FigureKey, Reason, Condition, Caution, Verdict, Severity, BillOfMaterialsLine, PriceKey } from './screening-types';
export { siteReadingsSchema, type SiteReadings, type SiteReadingsInput } from '@/lib/shared/schemas/site-readings';
export {
  bestPositions,
  bestPositionsBruteForce,
  STATION_FLAGS,
  REJECT_TEXT,
  type BestPositionsInput,
  type BestPositionsResult,
  type PositionPair,
  type ProfileStation,
  type ProfileTank,
  type RejectCode,
  type StationFlag,
} from './profile-search';
export {
  commissioningCheck,
  predictionFromFigures,
  BEATS_PER_MINUTE_BAND,
  type CommissioningReadings,
  type CommissioningPrediction,
  type CommissioningResult,
  type CommissioningOutcome,
  type LikelyCause,
} from './commissioning';
export {
  ramCycle,
  closureVelocityMps,
  valveWeightForClosureN,
  closureForBeats,
  wasteValveLossK,
  WASTE_VALVE_CLOSING_S,
  type RamCycle,
  type RamCycleInput,
} from './ram-cycle';
export { ASSUMED_STROKE_MM, wasteValveAdvice, designPointFromFigures, type DesignPoint, type WasteValveAdvice, type ValveMove } from './waste-valve-advice';

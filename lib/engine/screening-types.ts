import type { Message } from '@/lib/shared/display/message';
import type { Source, SourceId } from './sources';

/** 'gravity': the tank sits below the intake, so a pipe fills it and no pump is needed. */
export type Verdict = 'go' | 'conditional' | 'no-go' | 'gravity';
export type Severity = 'no-go' | 'conditional' | 'note';

/** A sentence's metric text, and (from engines that write it) the sentence with its figures as amounts, for each reader's units. */
export interface Said {
  text: string;
  message?: Message;
}

export interface Reason extends Said {
  code: string;
  severity: Severity;
}

export interface Condition extends Said {
  /** The reason this condition answers. */
  code: string;
}

export interface Caution extends Said {
  code: string;
}

export type FigureInputs = Record<string, number | string | boolean | null>;

/** One traced number: its value, unit, the rule that made it, the source of that rule and its inputs. */
export interface Figure {
  value: number | null;
  unit: string;
  rule: string;
  sourceId: SourceId;
  inputs: FigureInputs;
}

export type FigureKey =
  | 'fallM'
  | 'fallUncertaintyM'
  | 'supplyMeanLpm'
  | 'supplyLowestLpm'
  | 'supplySpreadLpm'
  | 'designFlowLpm'
  | 'driveFlowLpm'
  | 'staticLiftM'
  | 'staticLiftUncertaintyM'
  | 'deliveryFrictionM'
  | 'totalLiftM'
  | 'liftRatio'
  | 'efficiency'
  | 'deliveryLpm'
  | 'deliveryLpd'
  | 'wasteFlowLpm'
  | 'supplyToPumpedRatio'
  | 'demandLpd'
  | 'demandMarginLpd'
  | 'tankL'
  | 'driveLengthMinM'
  | 'driveLengthMaxM'
  | 'driveLengthM'
  | 'driveLengthToDiameter'
  | 'driveBoreMm'
  | 'driveVelocityMps'
  | 'driveClosureVelocityMps'
  | 'minimumClosureVelocityMps'
  | 'waveSpeedMps'
  | 'surgeHeadM'
  | 'peakPressureHeadM'
  | 'drivePipeRatingM'
  | 'deliveryBoreMm'
  | 'deliveryPipeRatingM'
  | 'probabilityMeetsDemand'
  | 'deliveryP10Lpd'
  | 'deliveryP50Lpd'
  | 'deliveryP90Lpd'
  | 'ramCount'
  | 'ramSizeIn'
  | 'attainableDriveVelocityMps'
  | 'workingPeakHeadM'
  | 'blockedDeliveryHeadM'
  | 'drivePipeAllowedHeadM'
  | 'gravityHeadM'
  | 'gravityPipeBoreMm'
  | 'gravityPipeLengthM'
  | 'gravityCapacityLpd'
  | 'feedPipeLengthM'
  | 'feedPipeBoreMm'
  | 'feedFrictionM'
  | 'drivingFallM';

/** What a line is priced as from the organisation's price list ('with-ram': comes with a bought ram). */
export type PriceKey = 'ram' | 'pipe' | 'valve' | 'gauge' | 'with-ram' | 'unions' | 'base' | 'intake' | 'tank' | 'relief-valve' | 'stand-pipe';

export interface BillOfMaterialsLine {
  item: string;
  size: string;
  quantity: number;
  unit: string;
  note: string;
  /** The size and note with their figures as amounts, for each reader's units. */
  sizeMessage?: Message;
  noteMessage?: Message;
  /** Absent on screenings made before lines were priced. */
  priceKey?: PriceKey;
  /** Pipes: material (engine id or label) and bore, to find the price per metre. */
  pipe?: { material: string; boreMm: number };
  /** Rams: drive pipe size, inches (a ram's price goes with its size). */
  driveIn?: number;
  /** Tanks: litres. */
  litres?: number;
  /** Needed whatever lifts the water (a pump would use it too): delivery pipe and valve, intake, tank. */
  shared?: boolean;
}

/** The result of screening one site: plain JSON, stored with the visit and rendered on the farmer's sheet. */
export interface Screening {
  engineVersion: string;
  verdict: Verdict;
  reasons: Reason[];
  conditions: Condition[];
  cautions: Caution[];
  figures: Partial<Record<FigureKey, Figure>>;
  billOfMaterials: BillOfMaterialsLine[];
  settings: Record<string, number | string>;
  monteCarlo: { samples: number; seed: number; generator: string };
  sources: Source[];
}

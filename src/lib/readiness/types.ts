// Input and output shapes of the readiness engine. The input mirrors the checklist JSON
// (field names are the public API); every field is optional and may be null because a
// customer fills the checklist over several sittings.
import type { DrivewayPlan } from './plan';
import type { ReadinessSettings } from './settings';

export type Light = 'green' | 'amber' | 'red';

export type Tenure = 'owner' | 'tenant';
export type PropertyType = 'house' | 'flat' | 'other';
export type VehicleCondition = 'new' | 'used';
export type Connector = 'type2' | 'type1' | 'unsure';
export type ChargePort =
  | 'front-left'
  | 'front-right'
  | 'front-centre'
  | 'rear-left'
  | 'rear-right'
  | 'side-left'
  | 'side-right';
export type FuseRating = 60 | 80 | 100;
export type Looped = 'yes' | 'no' | 'unsure';
export type Earthing = 'pme' | 'tns' | 'tt' | 'unknown';
export type SupplyPhases = 'single' | 'three' | 'unsure';
/** Measures of BS 7671 Regulation 722.411.4.1 the office or surveyor may record for PME. */
export type EarthingMeasure =
  | 'open-pen-device'
  | 'tt-electrode'
  | 'installation-electrode'
  | 'balanced-three-phase'
  | 'other-listed';
export type ParkingKind = 'attached-drive' | 'garage' | 'detached-bay' | 'none';
/** How the car is usually parked, as the customer answers it. */
export type ParkingHabit = 'nose-in' | 'reverse-in' | 'varies';
/** One definite way of parking (what "varies" expands to). */
export type ParkingWay = 'nose-in' | 'reverse-in';
export type CableRoute = 'through-wall' | 'along-wall' | 'through-house' | 'buried';
export type ChargerPreference = 'tethered' | 'socketed';

export interface AboutAnswers {
  fullName?: string | null;
  email?: string | null;
  phone?: string | null;
  addressLine1?: string | null;
  addressLine2?: string | null;
  town?: string | null;
  postcode?: string | null;
  tenure?: Tenure | null;
  propertyType?: PropertyType | null;
}

export interface VehicleAnswers {
  make?: string | null;
  model?: string | null;
  condition?: VehicleCondition | null;
  registration?: string | null;
  vin?: string | null;
  /** ISO calendar date, YYYY-MM-DD. */
  deliveryDate?: string | null;
  connector?: Connector | null;
  chargePort?: ChargePort | null;
}

export interface LoadAnswers {
  /** Electric shower rating in kW; 0 means no electric shower. */
  showerKw?: number | null;
  cooker?: boolean | null;
  immersion?: boolean | null;
  /** Heat pump rating in kW; 0 means none. */
  heatPumpKw?: number | null;
  /** Storage heaters, total kW; 0 means none. */
  storageHeaters?: number | null;
  otherEvCharger?: boolean | null;
  solarPv?: boolean | null;
  /** Socket circuits counted from the consumer unit's labels; 'unsure' is an answer. */
  socketCircuits?: number | 'unsure' | null;
}

export interface SupplyAnswers {
  mpanCore?: string | null;
  /** As read from the cut-out; null means the customer could not read it. */
  mainFuseAmps?: FuseRating | null;
  looped?: Looped | null;
  consumerUnitLocation?: string | null;
  earthing?: Earthing | null;
  /** Single or three phase, as read from the meter and cut-out; 'unsure' is an answer. */
  phases?: SupplyPhases | null;
  loads?: LoadAnswers | null;
}

export interface ParkingAnswers {
  kind?: ParkingKind | null;
  cars?: number | null;
  habit?: ParkingHabit | null;
}

export interface ChargerAnswers {
  location?: string | null;
  cableRunMetres?: number | null;
  route?: CableRoute | null;
  softGround?: boolean | null;
  softGroundMetres?: number | null;
  preference?: ChargerPreference | null;
  /** The charge point wanted, kW: 3.6, 7.4, 11 or 22. */
  ratingKw?: number | null;
  tetherMetres?: number | null;
  plan?: DrivewayPlan | null;
}

/** The customer's checklist answers, section by section. */
export interface ChecklistAnswers {
  about?: AboutAnswers | null;
  vehicle?: VehicleAnswers | null;
  supply?: SupplyAnswers | null;
  parking?: ParkingAnswers | null;
  charger?: ChargerAnswers | null;
}

export type UploadKind =
  | 'meter_photo'
  | 'cutout_photo'
  | 'consumer_unit_photo'
  | 'charger_location_photo'
  | 'parking_evidence'
  | 'order_agreement'
  | 'landlord_permission'
  | 'other';
export type UploadStatus = 'waiting' | 'accepted' | 'rejected';

/** What the engine needs to know about one upload: no file, no person. */
export interface UploadSummary {
  kind: UploadKind;
  status: UploadStatus;
  /** The office's reason when rejected. */
  reason?: string | null;
}

export type CheckId =
  | 'supply-identity'
  | 'supply-headroom'
  | 'network-operator'
  | 'earthing'
  | 'cable-run'
  | 'cable-reach'
  | 'parking'
  | 'timing'
  | 'documents';

/**
 * What the office or the surveyor recorded, which no customer answer can supply: a measured
 * maximum demand, the 722.411.4.1 measure chosen for PME, and a TT electrode's test values.
 */
export interface SiteMeasures {
  /** Existing maximum demand from smart-meter or logger data, amps (highest phase). */
  measuredMaxDemandAmps?: number | null;
  earthingMeasure?: EarthingMeasure | null;
  /** Earth electrode resistance RA, ohms. */
  electrodeOhms?: number | null;
  /** Rated residual operating current IΔn of the RCD protecting the electrode's circuit, mA. */
  rcdIdnMilliamps?: number | null;
}

/** Everything one check reads; settings are already resolved with their defaults. */
export interface CheckInput {
  answers: ChecklistAnswers;
  /** Recorded by staff; empty until they record something. */
  site: SiteMeasures;
  uploads: readonly UploadSummary[];
  settings: ReadinessSettings;
  /** Today's date, YYYY-MM-DD, passed in so the checks stay pure. */
  today: string;
}

export interface CheckResult {
  id: CheckId;
  light: Light;
  title: string;
  /** Plain, warm British English for the customer. */
  customerText: string;
  /** Trade terms for the office and the surveyor. */
  staffText: string;
  /** What the check computed, for the staff view and the survey pack. */
  figures: Record<string, unknown>;
  /** The published reference, or "Common practice — no published source". */
  source: string;
  /** What would turn the check green; empty when it is green. */
  actions: string[];
  /** Set when a surveyor's recorded findings replaced the customer's answer for this check. */
  confirmedOnSite?: boolean;
}

export type Check = (input: CheckInput) => CheckResult;

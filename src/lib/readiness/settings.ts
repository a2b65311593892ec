// Every threshold, assumption and lead time the checks use, with documented defaults, so the
// office can change them in one settings table without a code change.
import { z } from 'zod';

export const COMMON_PRACTICE = 'Common practice — no published source';

const amps = (value: number) => z.number().nonnegative().default(value);
const days = (value: number) => z.number().int().nonnegative().default(value);
const metres = (value: number) => z.number().nonnegative().default(value);
// Only ratings that exist: a free number here once let 20 A or 45 A through.
function oneOf<T extends number>(values: readonly [T, ...T[]], fallback: T, what: string) {
  const message = `${what}: choose ${values.slice(0, -1).join(', ')}${values.length > 1 ? ' or ' : ''}${values[values.length - 1]}.`;
  return z
    .number({ invalid_type_error: message })
    .refine((value): value is T => (values as readonly number[]).includes(value), { message })
    .default(fallback) as unknown as z.ZodDefault<z.ZodType<T, z.ZodTypeDef, T>>;
}

/** Single-phase charge-point currents the settings accept: 16 A (3.6 kW) and 32 A (7.4 kW). */
export const chargerAmpsValues = [16, 32] as const;
/** Protective-device ratings offered for the charge-point circuit (In). */
export const protectiveDeviceAmpsValues = [32, 40] as const;
/** Conductor temperatures the charge point's and device's terminals may be declared for. */
export const terminalTemperatureValues = [70, 90] as const;

/**
 * The readiness settings. Parse a partial object to fill in the defaults.
 *
 * @example readinessSettingsSchema.parse({ chargerAmps: 16 }).headroomMarginAmps // 10
 */
export const readinessSettingsSchema = z.object({
  nominalVoltage: z.number().positive().default(230),
  chargerAmps: oneOf(chargerAmpsValues, 32, 'Charger rated current'),
  headroomMarginAmps: amps(10),
  smallFuseAmps: amps(60),
  socketCircuitAmps: amps(32),
  assumedSocketCircuits: z.number().int().min(1).max(20).default(2),
  lightingKw: z.number().nonnegative().default(2),
  cookerKw: z.number().nonnegative().default(10),
  cookerUnitHasSocket: z.boolean().default(false),
  immersionKw: z.number().nonnegative().default(3),
  otherEvChargerAmps: amps(32),
  enaDemandLimitAmps: amps(60),
  notifyWithinDays: days(28),
  surveyLeadDays: days(7),
  installLeadDays: days(14),
  supplyUpgradeLeadDays: days(28),
  timingSlackDays: days(7),
  nearSoftGroundMetres: metres(10),
  voltageDropLimitPercent: z.number().positive().max(100).default(5),
  upstreamDropPercent: z.number().nonnegative().max(5).default(0),
  protectiveDeviceAmps: oneOf(protectiveDeviceAmpsValues, 32, 'Protective device rating'),
  terminalTemperatureC: oneOf(terminalTemperatureValues, 70, 'Terminal temperature'),
  longRunMetres: metres(15),
  cableSlackMetres: metres(1),
  defaultTetherMetres: z.number().positive().default(5),
  defaultCustomerCableMetres: z.number().positive().default(5),
  portInsetMetres: metres(0.8),
  // The photo check at upload (src/lib/server/photo-quality.server.ts).
  photoSharpnessMin: z.number().nonnegative().default(100),
  photoDarkMeanMax: z.number().min(0).max(255).default(45),
  photoShadowClipPercentMax: z.number().min(0).max(100).default(50),
  photoBrightMeanMin: z.number().min(0).max(255).default(215),
  photoHighlightClipPercentMax: z.number().min(0).max(100).default(20),
  photoDigitsMinLongEdgePx: z.number().int().min(1).max(10_000).default(1200),
  photoDigitsMinShortEdgePx: z.number().int().min(1).max(10_000).default(900),
  photoSceneMinLongEdgePx: z.number().int().min(1).max(10_000).default(800),
  photoSceneMinShortEdgePx: z.number().int().min(1).max(10_000).default(600),
  photoDuplicateMaxBits: z.number().int().min(0).max(64).default(6),
});

export type ReadinessSettings = z.output<typeof readinessSettingsSchema>;
export type ReadinessSettingsInput = z.input<typeof readinessSettingsSchema>;
export type ReadinessSettingKey = keyof ReadinessSettings;

/**
 * The settings with every default applied.
 *
 * @example defaultReadinessSettings.chargerAmps // 32
 */
export const defaultReadinessSettings: ReadinessSettings = Object.freeze(readinessSettingsSchema.parse({}));

/**
 * Fills in defaults for a partial settings object (for example, rows read from the settings table).
 *
 * @example resolveReadinessSettings({ surveyLeadDays: 3 }).installLeadDays // 14
 */
export function resolveReadinessSettings(partial?: ReadinessSettingsInput | null): ReadinessSettings {
  return readinessSettingsSchema.parse(partial ?? {});
}

export interface SettingDescription {
  label: string;
  meaning: string;
  unit: string;
  default: number | boolean;
  source: string;
}

type Described = Omit<SettingDescription, 'default'>;

const descriptions: Record<ReadinessSettingKey, Described> = {
  nominalVoltage: {
    label: 'Nominal supply voltage',
    meaning: 'Used to turn kW into amps and as the base of the voltage-drop percentage.',
    unit: 'V',
    source: 'Electricity Safety, Quality and Continuity Regulations 2002 (SI 2002/2665): 230 V +10% / −6%',
  },
  chargerAmps: {
    label: 'Charger rated current',
    meaning:
      'Assumed for a single-phase charge point while the customer has not chosen a rating: 16 A (3.6 kW) or 32 A (7.4 kW), taken at full rated current with no diversity. A chosen rating (3.6, 7.4, 11 or 22 kW) always wins.',
    unit: 'A',
    source: 'BS 7671:2018+A2:2022 Regulation 722.311; 32 A × 230 V ≈ 7.4 kW',
  },
  headroomMarginAmps: {
    label: 'Headroom margin',
    meaning: 'Spare capacity under the main fuse that counts as comfortable; less than this is amber.',
    unit: 'A',
    source: COMMON_PRACTICE,
  },
  smallFuseAmps: {
    label: 'Small main fuse',
    meaning: 'A main fuse at or below this rating is at least amber, whatever the arithmetic says.',
    unit: 'A',
    source: `${COMMON_PRACTICE} (a 60 A cut-out often needs an upgrade)`,
  },
  socketCircuitAmps: {
    label: 'Assumed rating of each socket circuit',
    meaning:
      'Each socket circuit the customer counts is taken at this rating (a 32 A ring final circuit is the usual one); Table A2 then takes 100% of the largest plus 40% of every other.',
    unit: 'A',
    source: `${COMMON_PRACTICE} (rating assumed); the 100% + 40% rule: IET On-Site Guide Appendix A, Table A2`,
  },
  assumedSocketCircuits: {
    label: 'Socket circuits assumed when not known',
    meaning:
      'Used for the estimate when the customer is not sure how many socket circuits there are. The estimate is then not firm, so the supply check stays amber at best.',
    unit: 'circuits',
    source: COMMON_PRACTICE,
  },
  lightingKw: {
    label: 'Assumed connected lighting load',
    meaning: 'The checklist does not ask about lighting: this connected load is assumed, and Table A2 takes 66% of it.',
    unit: 'kW',
    source: `${COMMON_PRACTICE} (load assumed); the 66% rule: IET On-Site Guide Appendix A, Table A2`,
  },
  cookerKw: {
    label: 'Assumed cooker rating',
    meaning: 'Rating assumed when the customer says only that there is an electric cooker.',
    unit: 'kW',
    source: COMMON_PRACTICE,
  },
  cookerUnitHasSocket: {
    label: 'Cooker control unit has a socket',
    meaning: 'Adds the 5 A that Table A2 allows for a socket outlet on the cooker control unit.',
    unit: 'yes/no',
    source: 'IET On-Site Guide Appendix A, Table A2',
  },
  immersionKw: {
    label: 'Assumed immersion heater rating',
    meaning: 'Rating assumed for a declared immersion heater (thermostatic, so taken at 100%).',
    unit: 'kW',
    source: COMMON_PRACTICE,
  },
  otherEvChargerAmps: {
    label: 'Existing EV charger current',
    meaning: 'An existing charge point, taken at this current with no diversity.',
    unit: 'A',
    source: 'BS 7671:2018+A2:2022 Regulation 722.311 (current assumed: common practice)',
  },
  enaDemandLimitAmps: {
    label: 'Connect & Notify demand limit',
    meaning: 'New maximum demand above this means applying to the network operator before installing.',
    unit: 'A',
    source: 'Energy Networks Association, "Connecting electric vehicles and heat pumps" and its application form (Connect & Notify criteria: 60 A, 13.8 kVA single phase)',
  },
  notifyWithinDays: {
    label: 'Notify the network operator within',
    meaning: 'Days after connection within which a Connect & Notify installation must be reported to the network operator.',
    unit: 'days',
    source: 'Energy Networks Association, "Connecting electric vehicles and heat pumps" and its application form (Connect & Notify: notify within 28 days)',
  },
  surveyLeadDays: {
    label: 'Survey lead time',
    meaning: 'Calendar days from today to the earliest survey visit.',
    unit: 'days',
    source: COMMON_PRACTICE,
  },
  installLeadDays: {
    label: 'Install lead time',
    meaning: 'Calendar days from the survey to the earliest install.',
    unit: 'days',
    source: COMMON_PRACTICE,
  },
  supplyUpgradeLeadDays: {
    label: 'Network operator lead time',
    meaning: 'Calendar days added when the network operator must approve or upgrade the supply first (from under a week to about a month).',
    unit: 'days',
    source: COMMON_PRACTICE,
  },
  timingSlackDays: {
    label: 'Timing slack',
    meaning: 'Fewer spare days than this between the earliest install and delivery is amber.',
    unit: 'days',
    source: COMMON_PRACTICE,
  },
  nearSoftGroundMetres: {
    label: 'Soft ground counts as near within',
    meaning: 'Open soil this close to the charge point makes an earth electrode practical.',
    unit: 'm',
    source: COMMON_PRACTICE,
  },
  voltageDropLimitPercent: {
    label: 'Voltage-drop limit',
    meaning: 'Largest voltage drop allowed, as a percentage of the nominal voltage, for non-lighting circuits.',
    unit: '%',
    source: 'BS 7671:2018+A2:2022 Appendix 4, section 6.4, Table 4Ab',
  },
  upstreamDropPercent: {
    label: 'Voltage drop already upstream',
    meaning:
      'Drop already used before the consumer unit that feeds the charge point, taken off the limit. Default 0%: the limit counts from the origin of the installation, and in the usual home the consumer unit sits at the origin; behind a sub-main, enter the sub-main’s drop.',
    unit: '%',
    source: 'BS 7671:2018+A2:2022 Appendix 4, section 6.4 (the limit applies from the origin of the installation)',
  },
  protectiveDeviceAmps: {
    label: 'Protective device rating, In',
    meaning:
      'The charge-point circuit’s overcurrent device, 32 A or 40 A. The cable’s corrected capacity must be at least this, not only the charger’s current (Ib ≤ In ≤ Iz).',
    unit: 'A',
    source: 'BS 7671:2018+A2:2022 Regulation 433.1.1',
  },
  terminalTemperatureC: {
    label: 'Terminal temperature rating',
    meaning:
      'Conductor temperature the charge point’s and device’s terminals are declared for. 70 °C (the usual) sizes a 90 °C cable on the 70 °C ratings; choose 90 only where both are declared for 90 °C.',
    unit: '°C',
    source: 'BS 7671:2018+A2:2022 Regulation 512.1.5 and the notes to the 90 °C Appendix 4 tables',
  },
  longRunMetres: {
    label: 'Long cable run',
    meaning: 'Runs longer than this are amber: more cable and labour to price.',
    unit: 'm',
    source: COMMON_PRACTICE,
  },
  cableSlackMetres: {
    label: 'Cable slack allowance',
    meaning: 'Added to the plan distance so a charging cable droops from the unit to the port rather than pulling taut.',
    unit: 'm',
    source: COMMON_PRACTICE,
  },
  defaultTetherMetres: {
    label: 'Tethered cable length if not given',
    meaning: 'Assumed length of a tethered unit\'s cable when the customer has not said.',
    unit: 'm',
    source: `${COMMON_PRACTICE} (a tethered cable is commonly about 5 m)`,
  },
  defaultCustomerCableMetres: {
    label: 'Customer\'s own cable length',
    meaning: 'Assumed length of the cable the customer plugs into a socketed unit.',
    unit: 'm',
    source: COMMON_PRACTICE,
  },
  portInsetMetres: {
    label: 'Charge port set back from the car\'s end',
    // From memory, not a published figure.
    meaning: 'How far a front or rear wing port sits from the bumper, roughly above the wheel.',
    unit: 'm',
    source: COMMON_PRACTICE,
  },
  photoSharpnessMin: {
    label: 'Photo sharpness, at least',
    meaning:
      'A photo whose sharpness is below this is flagged as blurred. Sharpness = variance of the Laplacian L = I(x−1,y) + I(x+1,y) + I(x,y−1) + I(x,y+1) − 4·I(x,y) over a 1024 px greyscale copy whose 1st–99th percentile of brightness is stretched to 0–255 (so darkness alone does not read as blur).',
    unit: 'variance',
    // The citation is recalled from memory (see photo-quality.server.ts), not checked against the paper.
    source: `${COMMON_PRACTICE} (the threshold); the measure: variance of the Laplacian, Pech-Pacheco et al., ICPR 2000`,
  },
  photoDarkMeanMax: {
    label: 'Too dark: mean brightness below',
    meaning: 'Mean luminance of the greyscale copy, 0 (black) to 255 (white); below this the photo is flagged as too dark.',
    unit: 'of 255',
    source: COMMON_PRACTICE,
  },
  photoShadowClipPercentMax: {
    label: 'Too dark: black share above',
    meaning: 'Share of pixels at 5 or less (of 255), where nothing can be read; above this the photo is flagged as too dark.',
    unit: '%',
    source: COMMON_PRACTICE,
  },
  photoBrightMeanMin: {
    label: 'Too bright: mean brightness above',
    meaning: 'Mean luminance above this flags the photo as over-exposed. Not applied to letters and plans, whose paper is meant to be white.',
    unit: 'of 255',
    source: COMMON_PRACTICE,
  },
  photoHighlightClipPercentMax: {
    label: 'Too bright: white share above',
    meaning: 'Share of pixels at 250 or more (of 255), burnt out to white; above this the photo is flagged as over-exposed (not for letters and plans).',
    unit: '%',
    source: COMMON_PRACTICE,
  },
  photoDigitsMinLongEdgePx: {
    label: 'Meter, cut-out and consumer unit photos (and letters): long side at least',
    meaning:
      'Phones send photos resized to 2560 px. Digits 40 px tall in a 12 MP (4032 px) frame are 12 px tall at 1200 px, the least that reads; smaller photos are flagged.',
    unit: 'px',
    source: COMMON_PRACTICE,
  },
  photoDigitsMinShortEdgePx: {
    label: 'Meter, cut-out and consumer unit photos (and letters): short side at least',
    meaning: 'The same for the short side (900 px is 1200 px at 4:3).',
    unit: 'px',
    source: COMMON_PRACTICE,
  },
  photoSceneMinLongEdgePx: {
    label: 'Charge point spot and other photos: long side at least',
    meaning: 'Photos that only need to show a place, not to be read.',
    unit: 'px',
    source: COMMON_PRACTICE,
  },
  photoSceneMinShortEdgePx: {
    label: 'Charge point spot and other photos: short side at least',
    meaning: 'The same for the short side.',
    unit: 'px',
    source: COMMON_PRACTICE,
  },
  photoDuplicateMaxBits: {
    label: 'Same photo in two slots: differing bits at most',
    meaning:
      'Photos are compared by a 64-bit difference hash (dHash: the greyscale photo shrunk to 9 × 8, bit = 1 where a pixel is darker than its right neighbour). A photo within this many differing bits of one in another slot is flagged as the same photo.',
    unit: 'bits',
    // The description is recalled from memory (see photo-quality.server.ts).
    source: `${COMMON_PRACTICE} (the difference hash, dHash, as N. Krawetz described it, 2013)`,
  },
};

/**
 * Label, meaning, unit, default and source of each setting, for the admin settings page.
 *
 * @example settingDescriptions.surveyLeadDays.default // 7
 */
export const settingDescriptions: Readonly<Record<ReadinessSettingKey, SettingDescription>> = Object.freeze(
  Object.fromEntries(
    (Object.keys(descriptions) as ReadinessSettingKey[]).map((key) => [
      key,
      { ...descriptions[key], default: defaultReadinessSettings[key] },
    ]),
  ) as Record<ReadinessSettingKey, SettingDescription>,
);

// Every threshold, assumption and lead time the checks use, with documented defaults, so the
// office can change them in one settings table without a code change.
import { z } from 'zod';

export const COMMON_PRACTICE = 'Common practice — no published source';

const amps = (value: number) => z.number().nonnegative().default(value);
const days = (value: number) => z.number().int().nonnegative().default(value);
const metres = (value: number) => z.number().nonnegative().default(value);

/**
 * The readiness settings. Parse a partial object to fill in the defaults.
 *
 * @example readinessSettingsSchema.parse({ chargerAmps: 16 }).headroomMarginAmps // 10
 */
export const readinessSettingsSchema = z.object({
  nominalVoltage: z.number().positive().default(230),
  chargerAmps: z.number().positive().default(32),
  headroomMarginAmps: amps(10),
  smallFuseAmps: amps(60),
  baselineAmps: amps(10),
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
  longRunMetres: metres(15),
  cableSlackMetres: metres(1),
  defaultTetherMetres: z.number().positive().default(5),
  defaultCustomerCableMetres: z.number().positive().default(5),
  portInsetMetres: metres(0.8),
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
    meaning: 'The new charge point, taken at full rated current with no diversity. 32 A ≈ 7.4 kW single phase.',
    unit: 'A',
    source: 'BS 7671:2018+A2:2022 Regulation 722.311',
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
  baselineAmps: {
    label: 'Lighting and sockets allowance',
    meaning:
      'A fixed allowance, after diversity, for lighting, socket outlets and small appliances; the checklist does not ask for circuit ratings, so the Table A2 socket rule cannot be applied circuit by circuit.',
    unit: 'A',
    source: COMMON_PRACTICE,
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
    source: 'IET On-Site Guide Appendix A, Table A2 (as reproduced in The Electrician\'s Guide, Table 6.2)',
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
    label: 'Notify-only demand limit',
    meaning: 'New maximum demand above this means applying to the network operator before installing.',
    unit: 'A',
    source: 'Energy Networks Association, "Connecting electric vehicles and heat pumps" (60 A, 13.8 kVA single phase)',
  },
  notifyWithinDays: {
    label: 'Notify the network operator within',
    meaning: 'Days after connection within which a notify-only installation must be reported.',
    unit: 'days',
    source: 'Energy Networks Association, "Connecting electric vehicles and heat pumps"',
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
    meaning: 'How far a front or rear wing port sits from the bumper, roughly above the wheel (from memory).',
    unit: 'm',
    source: `${COMMON_PRACTICE} (from memory)`,
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

// Client-safe: the words of every checklist field and option, for each audience, written once.
// The checklist, the office pages, the survey pack, the PDF, the gap lists and the e-mails all
// read them from here. Paths are the API's dotted paths ("supply.loads.showerKw"); option values
// are the saved values (numbers as their string form: "60", "7.4").
//
// One name per thing, for each audience:
//   customer: charge point (never "charger" on its own), consumer unit (the "fuse box" gloss
//             appears once, in the help of supply.consumerUnitLocation), charging socket on the
//             car, nose in / reversing in, MPAN with "supply number" as its explanation, title
//             plan, and "your installer" for the firm.
//   staff:    trade terms — MPAN core, cut-out, consumer unit, charge port, PME (TN-C-S), TN-S, TT.

/** One option's words. */
export type OptionWords = {
  /** The saved value. */
  value: string;
  /** What the customer reads on the choice. */
  customer: string;
  /** A line under the choice for the customer. */
  hint?: string;
  /** What the office and the surveyor read (the pack, the PDF, the case page). */
  staff: string;
  /** The trade's or a standard's own term, where there is one. */
  trade?: string;
};

/** One field's words. */
export type FieldWords = {
  /** The question or label the customer reads on the form and in "Check and send". */
  question: string;
  /** The short help under the question on the form, in the customer's words. */
  help?: string;
  /** The field as something still to give, in a list ("the postcode"). */
  gap: string;
  /** What a gap here holds up, completing "needed for …"; empty for an optional field. */
  blocks: string;
  /** The short label staff read beside the answer. */
  staff: string;
  /** The trade's or a standard's own term, where there is one. */
  trade?: string;
  /** The choices, in the order the form offers them. */
  options?: OptionWords[];
};

const YES_NO: OptionWords[] = [
  { value: 'yes', customer: 'Yes', staff: 'Yes' },
  { value: 'no', customer: 'No', staff: 'No' },
];

const NOT_SURE = { customer: 'I’m not sure', staff: 'Not sure' } as const;

// Left and right as seen from the driver's seat.
const chargePortOptions: OptionWords[] = [
  { value: 'front-left', customer: 'Front, left', staff: 'Front left' },
  { value: 'front-centre', customer: 'Front, middle', staff: 'Front centre' },
  { value: 'front-right', customer: 'Front, right', staff: 'Front right' },
  { value: 'side-left', customer: 'Left side, towards the back', staff: 'Left side, rear' },
  { value: 'side-right', customer: 'Right side, towards the back', staff: 'Right side, rear' },
  { value: 'rear-left', customer: 'Back, left', staff: 'Rear left' },
  { value: 'rear-right', customer: 'Back, right', staff: 'Rear right' },
];

const contact = 'your installer to contact you and book the survey';
const address = 'the survey visit and the network operator’s records';
const demand = 'working out whether your supply has room for a charge point';
const reach = 'checking the charging cable reaches the car where you park';
const identity = 'identifying the car for any grant and your installer’s records';
const route = 'choosing the cable size and estimating the cost';
const electrode = 'planning an earth rod, if one is needed';

/** Every checklist field's words, by dotted path, in the order the steps show them. */
export const fieldWords = {
  // About you
  'about.fullName': { question: 'Full name', gap: 'your name', blocks: contact, staff: 'Name' },
  'about.email': { question: 'E-mail address', help: 'Where your installer sends updates about the job.', gap: 'your e-mail address', blocks: contact, staff: 'E-mail' },
  'about.phone': { question: 'Phone number', help: 'A mobile is best, so your installer can reach you on the day.', gap: 'a phone number', blocks: contact, staff: 'Phone' },
  'about.addressLine1': { question: 'Address line 1', gap: 'the first line of the address', blocks: address, staff: 'Address line 1' },
  'about.addressLine2': { question: 'Address line 2 (optional)', gap: 'the second line of the address', blocks: '', staff: 'Address line 2' },
  'about.town': { question: 'Town or city', gap: 'the town', blocks: address, staff: 'Town' },
  'about.postcode': { question: 'Postcode', gap: 'the postcode', blocks: address, staff: 'Postcode' },
  'about.tenure': {
    question: 'Do you own or rent the home?',
    gap: 'whether you own or rent the home',
    blocks: 'knowing whether a landlord must agree first',
    staff: 'Owner or tenant',
    options: [
      { value: 'owner', customer: 'I own it', hint: 'Including with a mortgage or shared ownership.', staff: 'Owner' },
      { value: 'tenant', customer: 'I rent it', hint: 'Your landlord will need to agree to the charge point in writing.', staff: 'Tenant' },
    ],
  },
  'about.propertyType': {
    question: 'What kind of home is it?',
    gap: 'whether it is a house or a flat',
    blocks: 'planning the cable route (flats often need the building owner’s agreement)',
    staff: 'Property',
    options: [
      { value: 'house', customer: 'A house', hint: 'Detached, semi-detached, terraced or a bungalow.', staff: 'House' },
      { value: 'flat', customer: 'A flat or apartment', staff: 'Flat' },
      { value: 'other', customer: 'Something else', hint: 'For example a park home or a converted barn.', staff: 'Other' },
    ],
  },
  // Your vehicle
  'vehicle.make': { question: 'Make', help: 'For example, the maker’s name on the badge.', gap: 'the make of the car', blocks: 'checking the charge point suits the car', staff: 'Make' },
  'vehicle.model': { question: 'Model', help: 'As on your order or the car’s papers.', gap: 'the model of the car', blocks: 'checking the charge point suits the car', staff: 'Model' },
  'vehicle.condition': {
    question: 'Is the car new or used?',
    gap: 'whether the car is new or used',
    blocks: 'knowing which papers your installer needs',
    staff: 'New or used',
    options: [
      { value: 'new', customer: 'New', hint: 'Ordered from a dealer or maker.', staff: 'New' },
      { value: 'used', customer: 'Used', hint: 'It has been registered to someone before.', staff: 'Used' },
    ],
  },
  'vehicle.registration': { question: 'Registration number', help: 'The number plate, for example AB12 CDE.', gap: 'the registration (or the VIN if it is not registered yet)', blocks: identity, staff: 'Registration' },
  'vehicle.vin': { question: 'Vehicle identification number (VIN)', help: '17 letters and numbers, printed on your order form or the car’s papers. A VIN never has the letters I, O or Q.', gap: 'the VIN', blocks: identity, staff: 'VIN', trade: 'VIN' },
  'vehicle.deliveryDate': {
    question: 'Expected delivery date', help: 'Your best guess is fine. If the car is already with you, give the day it arrived.',
    gap: 'when the car is due',
    blocks: 'planning the timing, in case the network operator must be asked first',
    staff: 'Expected delivery',
  },
  'vehicle.connector': {
    question: 'Which plug does the car take?',
    gap: 'the car’s charging plug type',
    blocks: 'choosing a charge point that fits the car',
    staff: 'Connector',
    options: [
      { value: 'type2', customer: 'Type 2', hint: 'Nearly every car sold new in the UK in recent years. A round plug with a flat top edge and seven pins.', staff: 'Type 2', trade: 'IEC 62196-2 Type 2' },
      { value: 'type1', customer: 'Type 1', hint: 'Some older cars built for Japan or America. A round plug with five pins and a latch on top.', staff: 'Type 1', trade: 'IEC 62196-2 Type 1' },
      { value: 'unsure', ...NOT_SURE, hint: 'That’s fine: your installer can tell from the make and model.' },
    ],
  },
  'vehicle.chargePort': {
    question: 'Where is the charging socket on the car?', help: 'Left and right as you sit in the driver’s seat. This decides whether a cable reaches the car where you park.',
    gap: 'where the charging socket is on the car',
    blocks: reach,
    staff: 'Charge port on the car',
    options: chargePortOptions,
  },
  // Your supply
  'supply.mpanCore': {
    question: 'MPAN, your 13-digit supply number',
    help: 'The number that identifies your home’s electricity supply. It is printed on your electricity bill. Spaces are fine.',
    gap: 'the MPAN (the 13-digit supply number on your electricity bill)',
    blocks: 'identifying your supply and your network region',
    staff: 'MPAN core',
    trade: 'MPAN core',
  },
  'supply.mainFuseAmps': {
    question: 'Main fuse rating on the cut-out', help: 'The main fuse sits inside the cut-out. Its rating, in amps (A), is printed on the front of the fuse holder.',
    gap: 'the main fuse rating',
    blocks: demand,
    staff: 'Main fuse (cut-out), as read',
    trade: 'Cut-out fuse rating',
    options: [
      { value: '60', customer: '60 A', staff: '60 A' },
      { value: '80', customer: '80 A', staff: '80 A' },
      { value: '100', customer: '100 A', staff: '100 A' },
      { value: 'unreadable', customer: 'I can’t read it', hint: 'A fine answer: your installer will check it at the survey.', staff: 'Could not read it' },
    ],
  },
  'supply.looped': {
    question: 'Is the supply shared with a neighbour (looped)?', help: 'Some older homes, often terraces, share one supply cable with next door. Your installer needs to know, as the network operator may have to separate them first.',
    gap: 'whether the supply is shared (looped) with a neighbour',
    blocks: 'knowing whether the network operator must be asked first',
    staff: 'Looped supply',
    trade: 'Looped service',
    options: [
      { value: 'no', customer: 'No', hint: 'One supply cable, just for this home.', staff: 'No' },
      { value: 'yes', customer: 'Yes', hint: 'A cable runs from our cut-out to next door.', staff: 'Yes' },
      { value: 'unsure', ...NOT_SURE },
    ],
  },
  'supply.consumerUnitLocation': {
    question: 'Where is your consumer unit?', help: 'The consumer unit, often called the fuse box, holds your home’s switches and circuit breakers. For example: “under the stairs” or “garage, back wall”.',
    gap: 'where the consumer unit is',
    blocks: 'planning the cable route',
    staff: 'Consumer unit location',
  },
  'supply.earthing': {
    question: 'How is your home earthed?', help: 'How your wiring connects to earth, which is part of what keeps you safe. Your electrician will check it; tell us if you already know.',
    gap: 'the earthing type (“I don’t know” is fine)',
    blocks: 'planning the earthing and safety devices for the charge point',
    staff: 'Earthing, as answered',
    trade: 'Earthing arrangement (BS 7671 Part 3)',
    options: [
      { value: 'pme', customer: 'Through the supply cable (PME, also called TN-C-S)', hint: 'The usual arrangement in most UK homes. There is often a label near the meter reading “Protective Multiple Earthing”.', staff: 'PME (TN-C-S)', trade: 'TN-C-S' },
      { value: 'tns', customer: 'Through the supply cable’s metal sheath (TN-S)', hint: 'Common in older homes: a green-and-yellow earth wire is clamped to the lead or metal covering of the incoming cable.', staff: 'TN-S', trade: 'TN-S' },
      { value: 'tt', customer: 'Through a rod in the ground (TT)', hint: 'Common in the countryside with overhead lines: the earth wire runs outside to a metal rod in the ground.', staff: 'TT', trade: 'TT' },
      { value: 'unknown', customer: 'I don’t know', hint: 'A perfectly good answer. Your installer will check this at the survey.', staff: 'Not known' },
    ],
  },
  'supply.phases': {
    question: 'Is your supply single phase or three phase?', help: 'Most homes have a single-phase supply. Chargers above 7.4 kW need three phases, so it helps to know.',
    gap: 'whether the supply is single or three phase (“not sure” is fine)',
    blocks: 'knowing which charge points your supply can take',
    staff: 'Supply phases, as answered',
    options: [
      { value: 'single', customer: 'Single phase', hint: 'Most homes. One main fuse in the cut-out, and the meter shows a single reading.', staff: 'Single phase' },
      { value: 'three', customer: 'Three phase', hint: 'Three main fuses side by side in the cut-out (or one wide one marked 3-phase), and often “3 ph” or “400 V” on the meter.', staff: 'Three phase' },
      { value: 'unsure', ...NOT_SURE, hint: 'A fine answer: your photos of the meter and cut-out usually show it.' },
    ],
  },
  'supply.loads.socketCircuits': {
    question: 'How many socket circuits does your consumer unit have?', help: 'Look at the labels beside the switches in your consumer unit, or in your photo of it: count the ones marked sockets, ring or power. Don’t open anything.',
    gap: 'how many socket circuits there are (“not sure” is fine)',
    blocks: demand,
    staff: 'Socket circuits (from the consumer unit labels)',
    options: [
      ...['1', '2', '3', '4', '5', '6', '7', '8'].map((value) => ({ value, customer: value, staff: value })),
      { value: 'unsure', ...NOT_SURE, hint: 'That’s fine: we’ll assume a typical number and your installer will count them.' },
    ],
  },
  'supply.loads.showerKw': { question: 'Electric shower rating', help: 'An electric shower heats its own water, usually 7 to 10.5 kW.', gap: 'the electric shower rating (0 if none)', blocks: demand, staff: 'Electric shower' },
  'supply.loads.cooker': { question: 'An electric cooker, oven or hob?', help: 'An oven, hob or range that runs on electricity.', gap: 'whether there is an electric cooker', blocks: demand, staff: 'Electric cooker', options: YES_NO },
  'supply.loads.immersion': { question: 'An immersion heater for hot water?', help: 'An electric element that heats a hot-water cylinder.', gap: 'whether there is an immersion heater', blocks: demand, staff: 'Immersion heater', options: YES_NO },
  'supply.loads.heatPumpKw': { question: 'Heat pump rating', help: 'An air- or ground-source heat pump for heating.', gap: 'the heat pump rating (0 if none)', blocks: demand, staff: 'Heat pump' },
  'supply.loads.storageHeaters': { question: 'Storage heaters, total rating', help: 'All storage heaters added together, for example three of 2 kW make 6.', gap: 'the storage heaters’ total rating (0 if none)', blocks: demand, staff: 'Storage heaters (total)' },
  'supply.loads.otherEvCharger': { question: 'Another EV charge point already?', gap: 'whether there is another charge point already', blocks: demand, staff: 'Another EV charge point', options: YES_NO },
  'supply.loads.solarPv': { question: 'Solar panels or a home battery?', gap: 'whether there are solar panels or a home battery', blocks: demand, staff: 'Solar PV or battery', options: YES_NO },
  // Parking
  'parking.kind': {
    question: 'Where will you park to charge?', help: 'A home charge point needs parking off the road, so the cable never crosses a pavement.',
    gap: 'where the car will park',
    blocks: 'checking the home can have a charge point: it needs off-street parking',
    staff: 'Off-street parking',
    options: [
      { value: 'attached-drive', customer: 'A driveway at my home', hint: 'Part of the property, next to the house or flat.', staff: 'Driveway at the home' },
      { value: 'garage', customer: 'A garage at my home', hint: 'Joined to the house or within its grounds.', staff: 'Garage at the home' },
      { value: 'detached-bay', customer: 'A parking space away from my home', hint: 'For example an allocated bay in a shared car park. Your installer will ask for proof it is yours to use, such as a title plan or lease plan.', staff: 'Allocated bay, not attached to the home' },
      { value: 'none', customer: 'I have no off-street parking', hint: 'We’ll still pass your answers on; your installer will talk you through the options.', staff: 'None' },
    ],
  },
  'parking.cars': { question: 'How many cars park there?', help: 'Include the electric car. This helps us see where it will stand.', gap: 'how many cars park there', blocks: reach, staff: 'Cars parked there' },
  'parking.habit': {
    question: 'How do you usually park the electric car?', help: 'Together with where the car’s socket is, this tells us how far the cable must reach.',
    gap: 'how the car is usually parked',
    blocks: reach,
    staff: 'Usually parked',
    options: [
      { value: 'nose-in', customer: 'Nose in', hint: 'Driving straight in, front first.', staff: 'Nose in' },
      { value: 'reverse-in', customer: 'Reversing in', hint: 'Backing in, so the car faces out.', staff: 'Reversing in' },
      { value: 'varies', customer: 'It varies', staff: 'Varies (both ways checked)' },
    ],
  },
  // Charge point and cable route
  'charger.location': { question: 'Where would you like the charge point?', help: 'For example: “front wall of the house, to the left of the door” or “inside the garage, by the up-and-over door”.', gap: 'where you would like the charge point', blocks: 'planning where the charge point goes', staff: 'Wanted charge point location' },
  'charger.cableRunMetres': { question: 'Rough cable length from the consumer unit', help: 'From the consumer unit to that spot, following the walls rather than a straight line. A rough guess is fine; your installer will measure.', gap: 'roughly how far the charge point is from the consumer unit', blocks: route, staff: 'Cable run, customer’s estimate' },
  'charger.route': {
    question: 'How could the cable get there?',
    gap: 'how a cable could get there',
    blocks: route,
    staff: 'Cable route',
    options: [
      { value: 'through-wall', customer: 'Straight through the wall', hint: 'The consumer unit is on the other side of the wall from the charge point.', staff: 'Straight through the wall' },
      { value: 'along-wall', customer: 'Along the outside wall', hint: 'Out through the wall, then fixed along the outside.', staff: 'Along the outside wall' },
      { value: 'through-house', customer: 'Through the house', hint: 'Under floors, through rooms or the loft.', staff: 'Through the house' },
      { value: 'buried', customer: 'Buried underground', hint: 'Under a drive, path or garden, for example to a garage.', staff: 'Buried underground' },
    ],
  },
  'charger.softGround': { question: 'Is there soft ground near the charge point?', help: 'Open soil, such as a lawn or a flower bed, within a few metres of the charge point. Paving, tarmac and concrete don’t count.', gap: 'whether there is soft ground near the charge point', blocks: electrode, staff: 'Soft ground for an electrode', options: YES_NO },
  'charger.softGroundMetres': { question: 'How far is the soft ground from the charge point?', gap: 'how far the soft ground is', blocks: electrode, staff: 'Distance to soft ground' },
  'charger.preference': {
    question: 'Tethered or socketed?',
    gap: 'tethered or socketed',
    blocks: 'choosing the right charge point',
    staff: 'Tethered or socketed',
    options: [
      { value: 'tethered', customer: 'Tethered: cable attached', hint: 'The cable stays fixed to the charge point, usually about 5 m long. Unhook it and plug in.', staff: 'Tethered' },
      { value: 'socketed', customer: 'Socketed: bring your own cable', hint: 'The charge point has a socket. You plug in your own cable each time and can keep it in the car.', staff: 'Socketed' },
    ],
  },
  'charger.tetherMetres': { question: 'Length of the attached cable', help: 'Most attached cables are about 5 m. Longer ones, such as 7.5 m or 10 m, are available.', gap: 'the length of the tethered cable', blocks: reach, staff: 'Tethered cable length' },
  'charger.ratingKw': {
    question: 'How powerful a charge point would you like?', help: 'A 7.4 kW charger suits most homes and cars. If you’re not sure, choose 7.4 kW; your installer will confirm.',
    gap: 'how powerful a charge point you would like',
    blocks: 'choosing the cable size and checking your supply has room',
    staff: 'Charge point rating wanted',
    options: [
      { value: '3.6', customer: '3.6 kW', hint: 'Slower, about 15 miles of range an hour. Suits a small supply.', staff: '3.6 kW' },
      { value: '7.4', customer: '7.4 kW', hint: 'The usual home charge point, about 25 to 30 miles an hour. Single phase.', staff: '7.4 kW' },
      { value: '11', customer: '11 kW', hint: 'Needs a three-phase supply, and a car that can take it.', staff: '11 kW' },
      { value: '22', customer: '22 kW', hint: 'Needs a three-phase supply; few cars charge this fast at home.', staff: '22 kW' },
    ],
  },
  'charger.plan': { question: 'Your driveway plan', gap: 'a plan of your driveway', blocks: reach, staff: 'Driveway plan' },
  // The driveway plan's own choices (src/lib/readiness/plan.ts).
  'charger.plan.chargePort': {
    question: 'Where is the charging socket on the car?',
    gap: 'where the charging socket is on the car',
    blocks: reach,
    staff: 'Charge port, as picked on the plan',
    options: chargePortOptions,
  },
  'charger.plan.bays.kind': {
    question: 'What kind of space is it?',
    gap: 'what kind of space it is',
    blocks: '',
    staff: 'Space',
    options: [
      { value: 'driveway', customer: 'Driveway', staff: 'Driveway' },
      { value: 'garage', customer: 'Garage', staff: 'Garage' },
    ],
  },
  'charger.plan.bays.angle': {
    question: 'How does the car sit?',
    gap: 'how the car sits',
    blocks: reach,
    staff: 'Bay direction',
    options: [
      { value: '0', customer: 'End on to the house', hint: 'front or back to the wall', staff: 'End on to the wall' },
      { value: '90', customer: 'Along the house', hint: 'side to the wall', staff: 'Along the wall' },
    ],
  },
  // Saved from the wall looking out: the plan's 'left' end is on the right seen from the street.
  'charger.plan.bays.entry': {
    question: 'Which end do you drive in at?',
    gap: 'which end you drive in at',
    blocks: reach,
    staff: 'Drive-in end (seen from the street)',
    options: [
      { value: 'left', customer: 'From the right', staff: 'Right end' },
      { value: 'right', customer: 'From the left', staff: 'Left end' },
    ],
  },
  'charger.plan.car.sizeClass': {
    question: 'How big is the car?',
    gap: 'the size of the car',
    blocks: reach,
    staff: 'Car size',
    options: [
      { value: 'small', customer: 'Small', staff: 'Small' },
      { value: 'medium', customer: 'Medium', staff: 'Medium' },
      { value: 'large', customer: 'Large', staff: 'Large' },
      { value: 'custom', customer: 'Your own measurements', staff: 'Measured' },
    ],
  },
} as const satisfies Record<string, FieldWords>;

export type FieldPath = keyof typeof fieldWords;

/** Words for a group of fields the customer answers together ("supply.loads"). */
export const groupWords: Readonly<Record<string, Pick<FieldWords, 'gap' | 'staff'>>> = {
  'supply.loads': { gap: 'the big electrical appliances in the home, and how many socket circuits there are', staff: 'Declared loads' },
};

const all: Readonly<Record<string, FieldWords>> = fieldWords;

/**
 * A field's words, or undefined for a path that is not a field.
 *
 * @example wordsFor('supply.mpanCore')?.staff // 'MPAN core'
 */
export function wordsFor(path: string): FieldWords | undefined {
  return all[path];
}

/** Turns an unknown path into words rather than showing it raw ("supply.foo_bar" → "Foo bar"). */
function spelledOut(path: string): string {
  const last = path.split('.').pop() ?? path;
  const words = last.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/[-_]/g, ' ').toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/**
 * What a customer is asked to give, for gap lists and chasers: a grouped field's group words
 * (the appliances are asked as one), else the field's gap words, else the field spelled out.
 *
 * @example customerGapLabel('supply.loads.showerKw') // 'the big electrical appliances in the home, …'
 * @example customerGapLabel('about.postcode') // 'the postcode'
 */
export function customerGapLabel(path: string): string {
  const group = Object.keys(groupWords).find((g) => path === g || path.startsWith(`${g}.`));
  if (group) return groupWords[group]!.gap;
  return all[path]?.gap ?? spelledOut(path).toLowerCase();
}

/**
 * The staff label for a dotted answer path.
 *
 * @example staffLabel('supply.mpanCore') // 'MPAN core'
 */
export function staffLabel(path: string): string {
  return all[path]?.staff ?? groupWords[path]?.staff ?? spelledOut(path);
}

/**
 * The customer's question for a field.
 *
 * @example customerLabel('vehicle.chargePort') // 'Where is the charging socket on the car?'
 */
export function customerLabel(path: string): string {
  return all[path]?.question ?? spelledOut(path);
}

/**
 * The words of one saved option for an audience, or null when the value is not an option of
 * the field (callers then spell the value out, never show it raw).
 *
 * @example optionWords('vehicle.chargePort', 'side-left', 'staff') // 'Left side, rear'
 * @example optionWords('vehicle.chargePort', 'side-left', 'customer') // 'Left side, towards the back'
 */
export function optionWords(path: string, value: string | number | boolean, audience: 'customer' | 'staff'): string | null {
  const key = typeof value === 'boolean' ? (value ? 'yes' : 'no') : String(value);
  const option = all[path]?.options?.find((o) => o.value === key);
  return option ? option[audience] : null;
}

/**
 * The customer's hint under one option, if it has one.
 *
 * @example optionHint('charger.plan.bays.angle', 90) // 'side to the wall'
 */
export function optionHint(path: string, value: string | number): string | undefined {
  return all[path]?.options?.find((o) => o.value === String(value))?.hint;
}

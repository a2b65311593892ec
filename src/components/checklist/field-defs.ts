// Every checklist field as the customer meets it: its words, its choices, how the form holds it,
// and what the office cannot do without it. Paths are the API's dotted paths ("supply.loads.showerKw").
import type { SectionId } from '../../lib/schemas/checklist';

/** How a field is typed in the form; decides the conversion to and from the API value. */
/** 'numchoice' is a choice saved as a number, except a 'unsure' option, saved as the word. */
export type FieldKind = 'text' | 'phone' | 'choice' | 'numchoice' | 'number' | 'integer' | 'yesno' | 'fuse';

export type Option = { value: string; label: string; hint?: string; /** Spans the whole row of a grid. */ wide?: boolean };

export type FieldDef = {
  path: string;
  section: SectionId;
  kind: FieldKind;
  label: string;
  /** What a gap here holds up, in the customer's words ("…needed for …"). */
  blocks: string;
  options?: Option[];
  unit?: string;
};

const YES_NO: Option[] = [
  { value: 'yes', label: 'Yes' },
  { value: 'no', label: 'No' },
];

const contact = 'your installer to contact you and book the survey';
const demand = 'working out whether your supply has room for a charger';
const reach = 'checking the charging cable reaches the car where you park';

/** The fields in the order the steps show them. */
export const fieldDefs: FieldDef[] = [
  // About you
  { path: 'about.fullName', section: 'about', kind: 'text', label: 'Full name', blocks: contact },
  { path: 'about.email', section: 'about', kind: 'text', label: 'E-mail address', blocks: contact },
  { path: 'about.phone', section: 'about', kind: 'phone', label: 'Phone number', blocks: contact },
  { path: 'about.addressLine1', section: 'about', kind: 'text', label: 'Address line 1', blocks: 'the survey visit and the network operator’s records' },
  { path: 'about.addressLine2', section: 'about', kind: 'text', label: 'Address line 2 (optional)', blocks: '' },
  { path: 'about.town', section: 'about', kind: 'text', label: 'Town or city', blocks: 'the survey visit and the network operator’s records' },
  { path: 'about.postcode', section: 'about', kind: 'text', label: 'Postcode', blocks: 'the survey visit and the network operator’s records' },
  {
    path: 'about.tenure', section: 'about', kind: 'choice', label: 'Do you own or rent the home?',
    blocks: 'knowing whether a landlord must agree first',
    options: [
      { value: 'owner', label: 'I own it', hint: 'Including with a mortgage or shared ownership.' },
      { value: 'tenant', label: 'I rent it', hint: 'Your landlord will need to agree to the charge point in writing.' },
    ],
  },
  {
    path: 'about.propertyType', section: 'about', kind: 'choice', label: 'What kind of home is it?',
    blocks: 'planning the cable route (flats often need the building owner’s agreement)',
    options: [
      { value: 'house', label: 'A house', hint: 'Detached, semi-detached, terraced or a bungalow.' },
      { value: 'flat', label: 'A flat or apartment' },
      { value: 'other', label: 'Something else', hint: 'For example a park home or a converted barn.' },
    ],
  },
  // Your vehicle
  { path: 'vehicle.make', section: 'vehicle', kind: 'text', label: 'Make', blocks: 'checking the charge point suits the car' },
  { path: 'vehicle.model', section: 'vehicle', kind: 'text', label: 'Model', blocks: 'checking the charge point suits the car' },
  {
    path: 'vehicle.condition', section: 'vehicle', kind: 'choice', label: 'Is the car new or used?',
    blocks: 'knowing which papers your installer needs',
    options: [
      { value: 'new', label: 'New', hint: 'Ordered from a dealer or maker.' },
      { value: 'used', label: 'Used', hint: 'It has been registered to someone before.' },
    ],
  },
  { path: 'vehicle.registration', section: 'vehicle', kind: 'text', label: 'Registration number', blocks: 'identifying the car for any grant and your installer’s records' },
  { path: 'vehicle.vin', section: 'vehicle', kind: 'text', label: 'Vehicle identification number (VIN)', blocks: 'identifying the car for any grant and your installer’s records' },
  { path: 'vehicle.deliveryDate', section: 'vehicle', kind: 'text', label: 'Expected delivery date', blocks: 'planning the timing, in case the network operator must be asked first' },
  {
    path: 'vehicle.connector', section: 'vehicle', kind: 'choice', label: 'Which plug does the car take?',
    blocks: 'choosing a charge point that fits the car',
    options: [
      { value: 'type2', label: 'Type 2', hint: 'Nearly every car sold new in the UK in recent years. A round plug with a flat top edge and seven pins.' },
      { value: 'type1', label: 'Type 1', hint: 'Some older cars built for Japan or America. A round plug with five pins and a latch on top.' },
      { value: 'unsure', label: 'I’m not sure', hint: 'That’s fine: your installer can tell from the make and model.' },
    ],
  },
  {
    path: 'vehicle.chargePort', section: 'vehicle', kind: 'choice', label: 'Where is the charging socket on the car?',
    blocks: reach,
    options: [
      { value: 'front-left', label: 'Front, left' },
      { value: 'front-centre', label: 'Front, middle' },
      { value: 'front-right', label: 'Front, right' },
      { value: 'side-left', label: 'Left side, towards the back' },
      { value: 'side-right', label: 'Right side, towards the back' },
      { value: 'rear-left', label: 'Back, left' },
      { value: 'rear-right', label: 'Back, right' },
    ],
  },
  // Your supply
  { path: 'supply.mpanCore', section: 'supply', kind: 'text', label: 'MPAN core (13 digits)', blocks: 'identifying your supply and your network region' },
  {
    path: 'supply.mainFuseAmps', section: 'supply', kind: 'fuse', label: 'Main fuse rating on the cut-out',
    blocks: demand,
    options: [
      { value: '60', label: '60 A' },
      { value: '80', label: '80 A' },
      { value: '100', label: '100 A' },
      { value: 'unreadable', label: 'I can’t read it', hint: 'A fine answer: your installer will check it at the survey.', wide: true },
    ],
  },
  {
    path: 'supply.looped', section: 'supply', kind: 'choice', label: 'Is the supply shared with a neighbour (looped)?',
    blocks: 'knowing whether the network operator must be asked first',
    options: [
      { value: 'no', label: 'No', hint: 'One supply cable, just for this home.' },
      { value: 'yes', label: 'Yes', hint: 'A cable runs from our cut-out to next door.' },
      { value: 'unsure', label: 'I’m not sure' },
    ],
  },
  { path: 'supply.consumerUnitLocation', section: 'supply', kind: 'text', label: 'Where is your consumer unit (fuse box)?', blocks: 'planning the cable route' },
  {
    path: 'supply.earthing', section: 'supply', kind: 'choice', label: 'How is your home earthed?',
    blocks: 'planning the earthing and safety devices for the charge point',
    options: [
      { value: 'pme', label: 'Through the supply cable (PME, also called TN-C-S)', hint: 'The usual arrangement in most UK homes. There is often a label near the meter reading “Protective Multiple Earthing”.' },
      { value: 'tns', label: 'Through the supply cable’s metal sheath (TN-S)', hint: 'Common in older homes: a green-and-yellow earth wire is clamped to the lead or metal covering of the incoming cable.' },
      { value: 'tt', label: 'Through a rod in the ground (TT)', hint: 'Common in the countryside with overhead lines: the earth wire runs outside to a metal rod in the ground.' },
      { value: 'unknown', label: 'I don’t know', hint: 'A perfectly good answer. Your electrician will check this at the survey.' },
    ],
  },
  {
    path: 'supply.phases', section: 'supply', kind: 'choice', label: 'Is your supply single phase or three phase?',
    blocks: 'knowing which chargers your supply can take',
    options: [
      { value: 'single', label: 'Single phase', hint: 'Most homes. One main fuse in the cut-out, and the meter shows a single reading.' },
      { value: 'three', label: 'Three phase', hint: 'Three main fuses side by side in the cut-out (or one wide one marked 3-phase), and often “3 ph” or “400 V” on the meter.' },
      { value: 'unsure', label: 'I’m not sure', hint: 'A fine answer: your photos of the meter and cut-out usually show it.' },
    ],
  },
  {
    path: 'supply.loads.socketCircuits', section: 'supply', kind: 'numchoice', label: 'How many socket circuits does your fuse box have?',
    blocks: demand,
    options: [
      ...['1', '2', '3', '4', '5', '6', '7', '8'].map((value) => ({ value, label: value })),
      { value: 'unsure', label: 'I’m not sure', hint: 'That’s fine: we’ll assume a typical number and your installer will count them.', wide: true },
    ],
  },
  { path: 'supply.loads.showerKw', section: 'supply', kind: 'number', unit: 'kW', label: 'Electric shower rating', blocks: demand },
  { path: 'supply.loads.cooker', section: 'supply', kind: 'yesno', label: 'An electric cooker, oven or hob?', blocks: demand, options: YES_NO },
  { path: 'supply.loads.immersion', section: 'supply', kind: 'yesno', label: 'An immersion heater for hot water?', blocks: demand, options: YES_NO },
  { path: 'supply.loads.heatPumpKw', section: 'supply', kind: 'number', unit: 'kW', label: 'Heat pump rating', blocks: demand },
  { path: 'supply.loads.storageHeaters', section: 'supply', kind: 'number', unit: 'kW', label: 'Storage heaters, total rating', blocks: demand },
  { path: 'supply.loads.otherEvCharger', section: 'supply', kind: 'yesno', label: 'Another EV charge point already?', blocks: demand, options: YES_NO },
  { path: 'supply.loads.solarPv', section: 'supply', kind: 'yesno', label: 'Solar panels or a home battery?', blocks: demand, options: YES_NO },
  // Parking
  {
    path: 'parking.kind', section: 'parking', kind: 'choice', label: 'Where will you park to charge?',
    blocks: 'checking the home can have a charge point: it needs off-street parking',
    options: [
      { value: 'attached-drive', label: 'A driveway at my home', hint: 'Part of the property, next to the house or flat.' },
      { value: 'garage', label: 'A garage at my home', hint: 'Joined to the house or within its grounds.' },
      { value: 'detached-bay', label: 'A parking space away from my home', hint: 'For example an allocated bay in a shared car park. Your installer will ask for proof it is yours to use.' },
      { value: 'none', label: 'I have no off-street parking', hint: 'We’ll still pass your answers on; your installer will talk you through the options.' },
    ],
  },
  { path: 'parking.cars', section: 'parking', kind: 'integer', label: 'How many cars park there?', blocks: reach },
  {
    path: 'parking.habit', section: 'parking', kind: 'choice', label: 'How do you usually park the electric car?',
    blocks: reach,
    options: [
      { value: 'nose-in', label: 'Front first', hint: 'Driving straight in.' },
      { value: 'reverse-in', label: 'Reversing in' },
      { value: 'varies', label: 'It varies' },
    ],
  },
  // Charge point and cable route
  { path: 'charger.location', section: 'charger', kind: 'text', label: 'Where would you like the charge point?', blocks: 'planning where the charge point goes' },
  { path: 'charger.cableRunMetres', section: 'charger', kind: 'number', unit: 'm', label: 'Rough cable length from the consumer unit', blocks: 'choosing the cable size and estimating the cost' },
  {
    path: 'charger.route', section: 'charger', kind: 'choice', label: 'How could the cable get there?',
    blocks: 'choosing the cable size and estimating the cost',
    options: [
      { value: 'through-wall', label: 'Straight through the wall', hint: 'The consumer unit is on the other side of the wall from the charge point.' },
      { value: 'along-wall', label: 'Along the outside wall', hint: 'Out through the wall, then fixed along the outside.' },
      { value: 'through-house', label: 'Through the house', hint: 'Under floors, through rooms or the loft.' },
      { value: 'buried', label: 'Buried underground', hint: 'Under a drive, path or garden, for example to a garage.' },
    ],
  },
  { path: 'charger.softGround', section: 'charger', kind: 'yesno', label: 'Is there soft ground near the charge point?', blocks: 'planning an earth rod, if one is needed', options: YES_NO },
  { path: 'charger.softGroundMetres', section: 'charger', kind: 'number', unit: 'm', label: 'How far is the soft ground from the charge point?', blocks: 'planning an earth rod, if one is needed' },
  {
    path: 'charger.preference', section: 'charger', kind: 'choice', label: 'Tethered or socketed?',
    blocks: 'choosing the right charge point',
    options: [
      { value: 'tethered', label: 'Tethered: cable attached', hint: 'The cable stays fixed to the charge point, usually about 5 m long. Unhook it and plug in.' },
      { value: 'socketed', label: 'Socketed: bring your own cable', hint: 'The charge point has a socket. You plug in your own cable each time and can keep it in the car.' },
    ],
  },
  { path: 'charger.tetherMetres', section: 'charger', kind: 'number', unit: 'm', label: 'Length of the attached cable', blocks: reach },
  {
    path: 'charger.ratingKw', section: 'charger', kind: 'numchoice', label: 'How powerful a charger would you like?',
    blocks: 'choosing the cable size and checking your supply has room',
    options: [
      { value: '3.6', label: '3.6 kW', hint: 'Slower, about 15 miles of range an hour. Suits a small supply.' },
      { value: '7.4', label: '7.4 kW', hint: 'The usual home charger, about 25 to 30 miles an hour. Single phase.' },
      { value: '11', label: '11 kW', hint: 'Needs a three-phase supply, and a car that can take it.' },
      { value: '22', label: '22 kW', hint: 'Needs a three-phase supply; few cars charge this fast at home.' },
    ],
  },
];

/** Field definitions by dotted path. @example fieldByPath['supply.mpanCore'].label // 'MPAN core (13 digits)' */
export const fieldByPath: Readonly<Record<string, FieldDef>> = Object.fromEntries(fieldDefs.map((f) => [f.path, f]));

/** The fields of one section, in the order the step shows them. */
export function fieldsOf(section: SectionId): FieldDef[] {
  return fieldDefs.filter((f) => f.section === section);
}

/** The words for a choice's saved value, or the value itself when it is not a known choice. */
export function optionLabel(def: FieldDef, value: string): string {
  return def.options?.find((o) => o.value === value)?.label ?? value;
}

// Client-safe: plain words for each checklist field, for gap lists and chaser e-mails.
export const fieldLabels: Record<string, string> = {
  'about.fullName': 'your name',
  'about.email': 'your e-mail address',
  'about.phone': 'a phone number',
  'about.addressLine1': 'the first line of the address',
  'about.addressLine2': 'the second line of the address',
  'about.town': 'the town',
  'about.postcode': 'the postcode',
  'about.tenure': 'whether you own or rent the home',
  'about.propertyType': 'whether it is a house or a flat',
  'vehicle.make': 'the make of the car',
  'vehicle.model': 'the model of the car',
  'vehicle.condition': 'whether the car is new or used',
  'vehicle.registration': 'the registration (or the VIN if it is not registered yet)',
  'vehicle.vin': 'the VIN',
  'vehicle.deliveryDate': 'when the car is due',
  'vehicle.connector': 'the car’s charging plug type',
  'vehicle.chargePort': 'where the charging socket is on the car',
  'supply.mpanCore': 'the MPAN (supply number) from your electricity bill',
  'supply.mainFuseAmps': 'the main fuse rating',
  'supply.looped': 'whether the supply is shared (looped) with a neighbour',
  'supply.consumerUnitLocation': 'where the consumer unit (fuse box) is',
  'supply.earthing': 'the earthing type (“I don’t know” is fine)',
  'supply.phases': 'whether the supply is single or three phase (“not sure” is fine)',
  'supply.loads': 'the big electrical appliances in the home, and how many socket circuits there are',
  'parking.kind': 'where the car will park',
  'parking.cars': 'how many cars park there',
  'parking.habit': 'how the car is usually parked',
  'charger.location': 'where you would like the charge point',
  'charger.cableRunMetres': 'roughly how far the charge point is from the consumer unit',
  'charger.route': 'how a cable could get there',
  'charger.softGround': 'whether there is soft ground near the charge point',
  'charger.softGroundMetres': 'how far the soft ground is',
  'charger.preference': 'tethered or socketed',
  'charger.tetherMetres': 'the length of the tethered cable',
  'charger.ratingKw': 'how powerful a charger you would like',
};

/** The plain words for a dotted field path, falling back to the path itself. */
export function fieldLabel(section: string, field: string): string {
  const key = `${section}.${field.split('.')[0]}`;
  return fieldLabels[key] ?? `${section} ${field}`;
}

// Short staff labels for the checklist's fields, in trade terms; the customer's own wording
// (src/lib/field-labels.ts) is the fallback. Used by the answers panel and the audit trail.
import { fieldLabels } from '../../lib/field-labels';

const staffLabels: Record<string, string> = {
  'about.fullName': 'Name',
  'about.email': 'E-mail',
  'about.phone': 'Phone',
  'about.addressLine1': 'Address line 1',
  'about.addressLine2': 'Address line 2',
  'about.town': 'Town',
  'about.postcode': 'Postcode',
  'about.tenure': 'Tenure',
  'about.propertyType': 'Property type',
  'vehicle.make': 'Make',
  'vehicle.model': 'Model',
  'vehicle.condition': 'New or used',
  'vehicle.registration': 'Registration',
  'vehicle.vin': 'VIN',
  'vehicle.deliveryDate': 'Delivery date',
  'vehicle.connector': 'Connector',
  'vehicle.chargePort': 'Charge port position',
  'supply.mpanCore': 'MPAN core',
  'supply.mainFuseAmps': 'Main fuse (cut-out) rating',
  'supply.looped': 'Looped supply',
  'supply.consumerUnitLocation': 'Consumer unit location',
  'supply.earthing': 'Earthing arrangement',
  'supply.phases': 'Supply phases',
  'supply.loads.socketCircuits': 'Socket circuits',
  'supply.loads.showerKw': 'Electric shower',
  'supply.loads.cooker': 'Electric cooker',
  'supply.loads.immersion': 'Immersion heater',
  'supply.loads.heatPumpKw': 'Heat pump',
  'supply.loads.storageHeaters': 'Storage heaters (total)',
  'supply.loads.otherEvCharger': 'Existing EV charger',
  'supply.loads.solarPv': 'Solar PV or battery',
  'parking.kind': 'Off-street parking',
  'parking.cars': 'Cars parked',
  'parking.habit': 'Parking habit',
  'charger.location': 'Wanted charge point location',
  'charger.cableRunMetres': 'Cable run estimate',
  'charger.route': 'Cable route',
  'charger.softGround': 'Soft ground near',
  'charger.softGroundMetres': 'Soft ground distance',
  'charger.preference': 'Tethered or socketed',
  'charger.tetherMetres': 'Tethered cable length',
  'charger.ratingKw': 'Charge point rating',
  'charger.plan': 'Driveway plan',
};

/**
 * The staff label for a dotted checklist path.
 * @example staffLabel('supply.mpanCore') // 'MPAN core'
 */
export function staffLabel(path: string): string {
  if (staffLabels[path]) return staffLabels[path]!;
  const plain = fieldLabels[path];
  if (plain) return plain.charAt(0).toUpperCase() + plain.slice(1);
  return path;
}

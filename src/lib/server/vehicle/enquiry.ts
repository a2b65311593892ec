// Server-only: what Groundwork needs from a vehicle register, so the rest never names a service.

export type VehicleRecord = { registration: string; make: string | null; colour: string | null; fuelType: string | null; yearOfManufacture: number | null };

/** found: the record; not_found: no such plate; unavailable: slow, failing or refused — the customer types it. */
export type EnquiryAnswer = { status: 'found'; vehicle: VehicleRecord } | { status: 'not_found' } | { status: 'unavailable'; reason: string };

export interface VehicleEnquiry {
  /** Looks up a registration written without spaces, upper case. Never throws. */
  lookup(registration: string): Promise<EnquiryAnswer>;
}

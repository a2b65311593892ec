// Server-only: the government vehicle enquiry service over its REST API. Its shape here is from
// memory of the public API documentation: POST the URL with an `x-api-key` header and a JSON body
// { registrationNumber }; 200 answers make, colour, fuelType, yearOfManufacture (and more), 404
// means no vehicle with that plate, 400 a malformed plate, 403 a bad key, 429 over quota.
import type { EnquiryAnswer, VehicleEnquiry } from './enquiry';

type Settings = { url: string; apiKey: string; timeoutMs: number };

const text = (v: unknown) => (typeof v === 'string' && v.trim() !== '' ? v.trim() : null);

/** @example const ves = vehicleEnquiryService({ url, apiKey, timeoutMs: 2000 }); await ves.lookup('AB12CDE') */
export function vehicleEnquiryService(settings: Settings): VehicleEnquiry {
  return {
    async lookup(registration): Promise<EnquiryAnswer> {
      let res: Response;
      try {
        res = await fetch(settings.url, {
          method: 'POST',
          headers: { 'x-api-key': settings.apiKey, 'content-type': 'application/json', accept: 'application/json' },
          body: JSON.stringify({ registrationNumber: registration }),
          signal: AbortSignal.timeout(settings.timeoutMs),
        });
      } catch (err) {
        const timedOut = err instanceof Error && (err.name === 'TimeoutError' || err.name === 'AbortError');
        return { status: 'unavailable', reason: timedOut ? 'timeout' : 'unreachable' };
      }
      if (res.status === 404 || res.status === 400) {
        await res.body?.cancel();
        return { status: 'not_found' };
      }
      if (!res.ok) {
        await res.body?.cancel();
        return { status: 'unavailable', reason: `status ${res.status}` };
      }
      const body = (await res.json().catch(() => null)) as Record<string, unknown> | null;
      if (!body) return { status: 'unavailable', reason: 'not JSON' };
      const year = Number(body.yearOfManufacture);
      return {
        status: 'found',
        vehicle: {
          registration: text(body.registrationNumber) ?? registration,
          make: text(body.make),
          colour: text(body.colour),
          fuelType: text(body.fuelType),
          yearOfManufacture: Number.isInteger(year) ? year : null,
        },
      };
    },
  };
}

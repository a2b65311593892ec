// @ts-check
// Fake vehicle enquiry service: a local stand-in for the government vehicle register's REST API,
// in its shape as remembered from the public API documentation (POST with an x-api-key header
// and { registrationNumber }; errors as { errors: [{ status, code, title, detail }] }). The fleet
// is invented: plates whose age identifier (29, March 2029) has not been issued yet, and makers'
// names that belong to no real company.
import http from 'node:http';
import { pathToFileURL } from 'node:url';

const HOST = '127.0.0.1';
export const PATH = '/vehicle-enquiry/v1/vehicles';

/** The invented fleet, by registration without spaces. */
export const FLEET = {
  GW29EVA: { make: 'LARKSPUR', colour: 'BLUE', fuelType: 'ELECTRICITY', yearOfManufacture: 2025 },
  GW29EVB: { make: 'OSTREL', colour: 'WHITE', fuelType: 'ELECTRICITY', yearOfManufacture: 2024 },
  GW29PHV: { make: 'VELORAN', colour: 'GREY', fuelType: 'HYBRID ELECTRIC', yearOfManufacture: 2023 },
  GW29PET: { make: 'KESTRUNE', colour: 'RED', fuelType: 'PETROL', yearOfManufacture: 2019 },
  GW29DSL: { make: 'MARROWBY', colour: 'BLACK', fuelType: 'DIESEL', yearOfManufacture: 2017 },
  // The demo's registered cars (seeds/demo-checklists.ts, demoPlates): the same records.
  GW29RFG: { make: 'OSTREL', colour: 'GREY', fuelType: 'ELECTRICITY', yearOfManufacture: 2024 },
  GW29CHW: { make: 'LARKSPUR', colour: 'BLUE', fuelType: 'ELECTRICITY', yearOfManufacture: 2025 },
};
/** Answers after `slowMs` (default 5 s): longer than the app waits. */
export const SLOW_PLATE = 'GW29SLO';
/** Answers 500, as a service having a bad day. */
export const FAILING_PLATE = 'GW29ERR';

/**
 * @typedef {object} VehicleServerOptions
 * @property {number} [port] 0 lets the OS choose; defaults to FAKE_VEHICLE_PORT or 1095
 * @property {string} [apiKey] the accepted key (FAKE_VEHICLE_API_KEY, default "fake-vehicle-key")
 * @property {number} [slowMs]
 * @property {boolean} [quiet]
 */

/** @param {http.ServerResponse} res @param {number} status @param {unknown} body */
function sendJson(res, status, body) {
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8' });
  res.end(JSON.stringify(body));
}

/** @param {string} status @param {string} title @param {string} detail */
const errors = (status, title, detail) => ({ errors: [{ status, code: status, title, detail }] });

/**
 * @example const ves = await startVehicleServer({ port: 0, quiet: true }); … await ves.close();
 * @param {VehicleServerOptions} [options]
 */
export async function startVehicleServer(options = {}) {
  const apiKey = options.apiKey ?? process.env.FAKE_VEHICLE_API_KEY ?? 'fake-vehicle-key';
  const slowMs = options.slowMs ?? 5000;
  const log = options.quiet ? () => {} : (/** @type {string} */ line) => console.log(`[fake-vehicles] ${line}`);
  /** @type {{ registrationNumber: string, at: string }[]} */
  let requests = [];
  const timers = new Set();

  /** @param {http.IncomingMessage} req @param {http.ServerResponse} res */
  async function handle(req, res) {
    const url = new URL(req.url ?? '/', `http://${HOST}`);
    if (req.method === 'GET' && url.pathname === '/api/requests') return sendJson(res, 200, requests);
    if (req.method === 'DELETE' && url.pathname === '/api/requests') {
      requests = [];
      res.writeHead(204).end();
      return;
    }
    if (req.method === 'GET' && url.pathname === '/api/fleet') return sendJson(res, 200, FLEET);
    if (url.pathname !== PATH || req.method !== 'POST') return sendJson(res, 404, errors('404', 'Not Found', 'Try POST ' + PATH));
    // The real service sits behind an API gateway that answers a bad key with a bare message.
    if (req.headers['x-api-key'] !== apiKey) return sendJson(res, 403, { message: 'Forbidden' });
    let body;
    try {
      const chunks = [];
      for await (const c of req) chunks.push(c);
      body = JSON.parse(Buffer.concat(chunks).toString('utf8') || '{}');
    } catch {
      return sendJson(res, 400, errors('400', 'Bad Request', 'Invalid JSON'));
    }
    const plate = typeof body?.registrationNumber === 'string' ? body.registrationNumber.replace(/\s+/g, '').toUpperCase() : '';
    if (!/^[A-Z0-9]{1,7}$/.test(plate)) return sendJson(res, 400, errors('400', 'Bad Request', 'Invalid format for field - vehicle registration number'));
    requests.push({ registrationNumber: plate, at: new Date().toISOString() });
    log(`look-up ${plate}`);
    if (plate === FAILING_PLATE) return sendJson(res, 500, errors('500', 'Internal Server Error', 'System error occurred'));
    if (plate === SLOW_PLATE) {
      await new Promise((resolve) => {
        const t = setTimeout(resolve, slowMs);
        timers.add(t);
      });
      if (res.destroyed) return;
      return sendJson(res, 200, { registrationNumber: plate, make: 'LARKSPUR', colour: 'GREEN', fuelType: 'ELECTRICITY', yearOfManufacture: 2025 });
    }
    const v = /** @type {Record<string, { make: string, colour: string, fuelType: string, yearOfManufacture: number }>} */ (FLEET)[plate];
    if (!v) return sendJson(res, 404, errors('404', 'Vehicle Not Found', 'Record for vehicle not found'));
    return sendJson(res, 200, {
      registrationNumber: plate,
      taxStatus: 'Taxed',
      motStatus: 'No details held by DVLA',
      markedForExport: false,
      typeApproval: 'M1',
      wheelplan: '2 AXLE RIGID BODY',
      ...v,
    });
  }

  const server = http.createServer((req, res) => {
    handle(req, res).catch(() => sendJson(res, 500, errors('500', 'Internal Server Error', 'Fake failed')));
  });
  const wanted = options.port ?? Number(process.env.FAKE_VEHICLE_PORT ?? 1095);
  const port = await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(wanted, HOST, () => {
      const a = server.address();
      resolve(typeof a === 'object' && a ? a.port : wanted);
    });
  });
  const close = () =>
    new Promise((resolve) => {
      for (const t of timers) clearTimeout(t);
      server.close(() => resolve(undefined));
      server.closeAllConnections();
    });
  return { port: /** @type {number} */ (port), close };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const running = await startVehicleServer();
  console.log(`[fake-vehicles] vehicle enquiry API on http://${HOST}:${running.port}${PATH}`);
  const stop = () => running.close().then(() => process.exit(0));
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

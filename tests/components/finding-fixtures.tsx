/** Shared data and wrapping for the finding tests: the demo finding, a repair check as the engine answers, fetch recorded. */
import type { ReactElement } from 'react';
import type { FindingDetail, TravelerDetail } from '@/db/contracts';
import { findingKeys, type RepairCheckResult } from '@/hooks/queries/findings';
import { travelerKeys } from '@/hooks/queries/travelers';
import { renderInApp, testQueryClient } from './render-web';

/** Holes U-08 and U-09 of W-104, MS20470AD4 at 0.25 in edge distance, 1 in pitch. */
export const finding: FindingDetail = {
  id: 'f-1',
  travelerId: 'trav-1',
  buildId: 'b-1',
  serial: 'NK2-0147-W-104',
  partNumber: 'W-104',
  kitSerial: 'NK2-0147',
  holeIds: ['U-08', 'U-09'],
  kind: 'hole_elongated',
  status: 'raised',
  disposition: null,
  closure: null,
  raisedByName: 'Sam Builder',
  createdAt: '2025-01-10T10:00:00.000Z',
  updatedAt: '2025-01-10T10:00:00.000Z',
  photoCount: 1,
  thumbUrl: null,
  note: 'Holes look oval',
  dispositionNote: null,
  measurements: { holeDiameterIn: 0.14 },
  repair: null,
  photos: [{ id: 'p1', width: 640, height: 480, url: '/p1', thumbUrl: '/p1t', stage: 'found', eventId: null }],
  events: [
    {
      id: 'e1',
      action: 'raise',
      actorName: 'Sam Builder',
      actorPlace: 'builder',
      fromStatus: null,
      toStatus: 'raised',
      disposition: null,
      note: 'Holes look oval',
      createdAt: '2025-01-10T10:00:00.000Z',
    },
  ],
  allowedActions: ['disposition', 'not-a-defect'],
  place: 'inspector',
  replacement: null,
  context: {
    holes: [
      { holeId: 'U-08', line: 'U', stationIn: 8, prevStationIn: 7, nextStationIn: 9, status: 'flagged' },
      { holeId: 'U-09', line: 'U', stationIn: 9, prevStationIn: 8, nextStationIn: 10, status: 'flagged' },
    ],
    edgeDistanceIn: 0.25,
    drillDiameterIn: 0.1285,
    rivetSpec: 'MS20470AD4',
    rivetDiameterIn: 0.125,
    countersunk: false,
    gaugeIn: 0.032,
    material: '6061-T6',
    oversizeOptions: [
      { code: 'MS20470AD5', dash: 5, step: 1 },
      { code: 'MS20470AD6', dash: 6, step: 2 },
    ],
  },
};

export const caution =
  "An aid only: the kit supplier's approved data and the applicable airworthiness rules and local authority govern. " +
  'Margins come from the inputs given and are only as good as they are. Nothing here is certification or approval of a design or repair.';

const noMargins = {
  shearLimit: null,
  shearUltimate: null,
  tensionLimit: null,
  tensionUltimate: null,
  combinedLimit: null,
  combinedUltimate: null,
};

/**
 * AD4 → AD5 over U-08 and U-09: U-08 measured at 0.28 in edge distance, short of 2D = 0.3125 in; U-09
 * at its 0.25 in layout, short too. Shaped as server/engineering/repair-check.ts answers.
 */
export const failedCheck: RepairCheckResult = {
  inputs: {
    rivetSpec: 'MS20470AD4',
    proposedSpec: 'MS20470AD5',
    gaugeIn: 0.032,
    material: '6061-T6',
    holes: [
      {
        holeId: 'U-08',
        stationIn: 8,
        neighbourStationsIn: [7, 9],
        edgeDistanceIn: 0.25,
        measured: { edgeDistanceIn: 0.28 },
      },
      { holeId: 'U-09', stationIn: 9, neighbourStationsIn: [8, 10], edgeDistanceIn: 0.25 },
    ],
  },
  rules: ['layout: edge distance ≥ 2D, pitch ≥ 3D of the new diameter (FAA AC 43.13-1B ch. 4)'],
  warnings: ['no applied loads given: strength margins are not checked, only the layout'],
  caution,
  pass: false,
  reasons: [
    'U-08: edge distance 0.2800 in is less than 2D = 0.3125 in for MS20470AD5',
    'U-09: edge distance 0.2500 in is less than 2D = 0.3125 in for MS20470AD5',
  ],
  holes: [
    {
      holeId: 'U-08',
      pass: false,
      reasons: ['edge distance 0.2800 in is less than 2D = 0.3125 in for MS20470AD5'],
      edgeDistanceUsedIn: 0.28,
      edgeDistanceMeasured: true,
      pitchToNeighboursIn: [1, 1],
      margins: noMargins,
      alternative: 'repair with doubler',
    },
    {
      holeId: 'U-09',
      pass: false,
      reasons: ['edge distance 0.2500 in is less than 2D = 0.3125 in for MS20470AD5'],
      edgeDistanceUsedIn: 0.25,
      edgeDistanceMeasured: false,
      pitchToNeighboursIn: [1, null],
      margins: noMargins,
      alternative: 'repair with doubler',
    },
  ],
  newDrill: { name: '#21', diameterIn: 0.159 },
  requiredEdgeIn: 0.3125,
  requiredPitchIn: 0.46875,
  countersink: null,
  alternative: 'repair with doubler',
};

export const passedCheck: RepairCheckResult = {
  ...failedCheck,
  pass: true,
  reasons: [],
  alternative: null,
  warnings: [],
  holes: failedCheck.holes.map((h) => ({ ...h, pass: true, reasons: [], alternative: null, edgeDistanceUsedIn: 0.35 })),
};

export type Call = { url: string; method: string; body: unknown };

/**
 * Records every request and answers by URL: `routes` maps the end of a path to a status and body (or a
 * function of the body sent). Multipart bodies are kept as their FormData.
 */
export function recordFetch(
  routes: Record<string, { status?: number; body: unknown } | ((sent: unknown) => { status?: number; body: unknown })>,
) {
  const calls: Call[] = [];
  global.fetch = jest.fn(async (url: string, init?: { body?: unknown; method?: string }) => {
    const u = String(url);
    if (u.startsWith('data:'))
      return { ok: true, status: 200, blob: async () => new Blob(['x'], { type: 'image/jpeg' }) };
    const sent = typeof init?.body === 'string' ? JSON.parse(init.body) : init?.body;
    calls.push({ url: u, method: init?.method ?? 'GET', body: sent });
    const key = Object.keys(routes).find((k) => u.split('?')[0].endsWith(k));
    const route = key
      ? routes[key]
      : { status: 404, body: { error: { code: 'not_found', message: `no route for ${u}` } } };
    const r = typeof route === 'function' ? route(sent) : route;
    const status = r.status ?? 200;
    return { ok: status < 400, status, text: async () => JSON.stringify(r.body) };
  }) as unknown as typeof fetch;
  return calls;
}

export function wrap(
  ui: ReactElement,
  seed: { finding?: FindingDetail; traveler?: TravelerDetail } = {},
  system: 'imperial' | 'metric' = 'imperial',
) {
  const qc = testQueryClient();
  if (seed.finding) qc.setQueryData(findingKeys.detail(seed.finding.id), seed.finding);
  if (seed.traveler) qc.setQueryData(travelerKeys.detail(seed.traveler.id), seed.traveler);
  const r = renderInApp(ui, qc, system);
  return { ...r, qc };
}

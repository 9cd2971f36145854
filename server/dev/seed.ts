import sharp from 'sharp';
import { noticeInput, type RevisionInput, type RevisionStep } from '../../db/contracts';
import type { Database } from '../../db';
import { hashPassword } from '../auth/passwords';
import { buildsService } from '../builds/builds-service';
import { couponsService } from '../coupons/coupons-service';
import { designsService } from '../designs/designs-service';
import { DEMO_COUPONS, DEMO_KIT, DEMO_RIB_STOCK, DEMO_STUDY_INPUTS, DEMO_WING_INPUTS } from './demo-inputs';
import { findingsService } from '../findings/findings-service';
import type { MailQueue } from '../jobs/mail-queue';
import { kitsService } from '../kits/kits-service';
import { noticesService } from '../notices/notices-service';
import { anyUserExists, insertOrganization, insertUser } from '../people/people-repository';
import { studiesService } from '../studies/studies-service';
import { createUrlSigner } from '../photos/url-signer';
import type { PhotoStorage } from '../storage/photo-storage';
import { travelersService } from '../travelers/travelers-service';

/** The invented demo scenario: one supplier, one kit, one builder, one inspector. Every sign-in's password. */
export const DEMO_PASSWORD = 'pitchcard-demo';
export const DEMO_USERS = {
  supplier: { email: 'maren@northfold.example', name: 'Maren Holt', role: 'supplier' as const },
  builder: { email: 'tobias@benchwork.example', name: 'Tobias Fenn', role: 'builder' as const },
  inspector: { email: 'priya@checkpoint.example', name: 'Priya Ashdown', role: 'inspector' as const },
  admin: { email: 'admin@pitchcard.example', name: 'Site Admin', role: 'admin' as const },
};

/** A revision as the demo writes it: every field given. */
type DemoRevision = Required<Omit<RevisionInput, 'steps' | 'changeNote'>> & {
  steps: RevisionStep[];
  changeNote: string;
};
type DemoLine = DemoRevision['lines'][number];

/** A rib flange line of the demo's ribs: 44 in long from 1 in aft of the nose, in pitch zones. */
const flangeLine = (code: string, name: string, surface: DemoLine['surface'], zones: DemoLine['zones']): DemoLine => ({
  code,
  name,
  surface,
  startIn: 1,
  lengthIn: 44,
  zones,
});

function ribRevision(over: Partial<RevisionInput> = {}): DemoRevision {
  return {
    ...DEMO_RIB_STOCK,
    chordIn: 54,
    lines: [
      flangeLine('U', 'Upper flange', 'upper', [
        { fromIn: 0, toIn: 8, pitchIn: 1 },
        { fromIn: 8, toIn: 24, pitchIn: 1.5 },
        { fromIn: 24, toIn: 44, pitchIn: 2 },
      ]),
      flangeLine('L', 'Lower flange', 'lower', [
        { fromIn: 0, toIn: 12, pitchIn: 1.5 },
        { fromIn: 12, toIn: 44, pitchIn: 2 },
      ]),
    ],
    steps: [
      { text: 'Deburr all holes and flute the flanges straight', kind: 'deburr', inspectionPoint: false },
      // The fit is checked before any rivet goes in: a bad fit found after riveting means drilling out.
      { text: 'Cleco rib to spar and skin; check flange fit', kind: 'inspect', inspectionPoint: true },
      { text: 'Rivet upper flange', kind: 'rivet', inspectionPoint: false },
      { text: 'Rivet lower flange', kind: 'rivet', inspectionPoint: false },
      { text: 'Inspect shop heads', kind: 'inspect', inspectionPoint: false },
    ],
    changeNote: '',
    ...over,
  } as never;
}

/** A line of the demo skin: on the upper surface, its whole length at a 1 in pitch. */
const skinLine = (code: string, name: string, lengthIn: number): DemoLine => ({
  code,
  name,
  surface: 'upper',
  startIn: 0,
  lengthIn,
  zones: [{ fromIn: 0, toIn: lengthIn, pitchIn: 1 }],
});

/**
 * A draft upper skin of the root bay (W-101 to W-102) for the wing study to be applied to: the spar lines
 * run the bay's 14.5 in, the rib lines the 29.7 in between the spars along the surface. A revision's
 * lines all run one way within its chord, so the chord here is the panel's longest side.
 */
export const DEMO_SKIN_REVISION: DemoRevision = {
  material: '6061-T6',
  gaugeIn: 0.025,
  rivetSpec: 'MS20426AD3',
  drillSize: '#40',
  drillDiameterIn: 0.098,
  edgeDistanceIn: 0.25,
  chordIn: 30,
  lines: [
    skinLine('FS', 'Front spar', 14.5),
    skinLine('RS', 'Rear spar', 14.5),
    skinLine('IR', 'Rib W-101 (inboard)', 29.7),
    skinLine('OR', 'Rib W-102 (outboard)', 29.7),
  ],
  steps: [
    { text: 'Deburr and dimple the skin holes', kind: 'dimple_countersink', inspectionPoint: false },
    { text: 'Cleco skin to spars and ribs', kind: 'inspect', inspectionPoint: true },
    { text: 'Rivet spars, then ribs, from the middle out', kind: 'rivet', inspectionPoint: false },
  ],
  changeNote: '',
};

/** A stand-in bench photo: a drilled hole in a sheet, drawn, so the demo needs no binary files. */
async function demoPhoto(): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="800" height="600">
    <rect width="800" height="600" fill="#9aa0a6"/><rect x="0" y="380" width="800" height="220" fill="#7d848b"/>
    <ellipse cx="400" cy="300" rx="70" ry="52" fill="#2b2e31"/><ellipse cx="400" cy="300" rx="82" ry="62" fill="none" stroke="#c9ced3" stroke-width="6"/>
    <circle cx="240" cy="300" r="46" fill="#b9bec3" stroke="#5b6166" stroke-width="5"/><circle cx="560" cy="300" r="46" fill="#b9bec3" stroke="#5b6166" stroke-width="5"/></svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}

/** The supplier's notice on the inboard rib that the running demo carries (seedDemo's `notice`). */
export const DEMO_NOTICE = {
  level: 'recommended',
  title: 'Deburr W-104 flange holes on both sides before priming',
  body:
    'A burr left under a rivet head holds the sheets apart: the joint then carries its load on the rivet ' +
    'alone and the hole can work loose. Before priming, deburr both sides of every flange hole of W-104 ' +
    'with a hand deburring tool, one turn only, and check with a fingertip that the edge is smooth. ' +
    'Acknowledge this notice when you have read it; record it as done with the part.',
} as const;

/**
 * Loads the demo when the database has no users yet; a second run changes nothing. With `notice`, the
 * supplier has also issued a notice that reaches the build's inboard rib (the running product's demo);
 * the tests' scenario leaves it out, so their build log and mail figures are those of the loop alone.
 */
export async function seedDemo(
  database: Database,
  storage: PhotoStorage,
  mailQueue: MailQueue,
  jwtSecret: string,
  opts: { notice?: boolean } = {},
): Promise<boolean> {
  const { db, pool } = database;
  if (await anyUserExists(db)) return false;

  const supplierOrg = await insertOrganization(db, 'Northfold Kitworks', 'supplier');
  const shop = await insertOrganization(db, 'Benchwork Hangar 3', 'shop');
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const made: Record<string, Express.User> = {};
  for (const [key, u] of Object.entries(DEMO_USERS)) {
    const organizationId = u.role === 'supplier' ? supplierOrg.id : u.role === 'admin' ? null : shop.id;
    const row = await insertUser(db, { ...u, organizationId, passwordHash, lead: u.role === 'supplier' });
    made[key] = {
      id: row.id,
      email: row.email,
      name: row.name,
      role: row.role,
      lead: row.lead,
      organizationId,
      organizationName: organizationId === supplierOrg.id ? supplierOrg.name : organizationId ? shop.name : null,
    };
  }
  const { supplier, builder } = made;

  const kit = await kitsService(db).create(supplier, {
    code: 'NK-2',
    name: 'NK-2 Quillon two-seat trainer',
    ...DEMO_KIT,
    airfoil: 'NACA 2412',
  });
  const designs = designsService(db);
  const inner = await designs.create(supplier, {
    design: { kitModelId: kit.id, partNumber: 'W-104', name: 'Wing rib, inboard', kind: 'rib' },
    revision: ribRevision(),
  });
  await designs.publish(supplier, inner.revisions[0].id);
  const outer = await designs.create(supplier, {
    design: { kitModelId: kit.id, partNumber: 'W-105', name: 'Wing rib, outboard', kind: 'rib' },
    revision: ribRevision({ gaugeIn: 0.02 }),
  });
  await designs.publish(supplier, outer.revisions[0].id);

  await buildsService({ db, pool, mailQueue, config: { publicUrl: '' } }).create(supplier, {
    kitModelId: kit.id,
    kitSerial: 'NK2-0147',
    builderEmail: DEMO_USERS.builder.email,
    inspectorEmail: DEMO_USERS.inspector.email,
  });

  // A later change to the outboard rib: its traveler in the build shows the newer revision.
  const revB = await designs.newRevision(supplier, outer.id, {
    ...ribRevision({ gaugeIn: 0.025 }),
    changeNote: 'Gauge up to 0.025 in: flange pull-through margin at the nose was thin',
  });
  await designs.publish(supplier, revB.id);

  // The supplier's flange coupons (6061-T6, pulled 1/8 in rivets, 1 in wide) and the rib study they back.
  const coupons = couponsService(db);
  for (const [gaugeIn, loadLb, outcome, note] of DEMO_COUPONS) {
    await coupons.create(supplier, {
      material: '6061-T6',
      gaugeIn,
      couponWidthIn: 1,
      rivetSpec: 'PULLED-4',
      loadLb,
      outcome,
      note,
      testedOn: '2026-10-14',
    });
  }
  // The wing study first, so the rib study stays the newest (first in the list, as before wing studies).
  const studies = studiesService(db);
  await studies.create(supplier, {
    kind: 'wing',
    kitModelId: kit.id,
    name: 'Whole wing, ten ribs, flight envelope',
    inputs: DEMO_WING_INPUTS,
  });
  await studies.create(supplier, {
    kind: 'rib',
    kitModelId: kit.id,
    name: 'Inboard rib W-104, flight envelope',
    inputs: DEMO_STUDY_INPUTS,
  });
  await designs.create(supplier, {
    design: { kitModelId: kit.id, partNumber: 'W-201', name: 'Wing skin, upper, root bay', kind: 'skin_panel' },
    revision: DEMO_SKIN_REVISION,
  });

  const signer = createUrlSigner(jwtSecret);
  const findings = findingsService({ db, pool, storage, signer, mailQueue });
  const travelers = travelersService(db, pool, findings.list);
  const parts = await travelers.list(builder);
  const innerTraveler = parts.find((t) => t.partNumber === 'W-104')!;
  await travelers.tickHoles(builder, innerTraveler.id, {
    holeIds: ['U-01', 'U-02', 'U-03', 'U-04', 'U-05', 'U-06', 'U-07', 'U-08'],
    status: 'installed',
  });
  await travelers.setStep(builder, innerTraveler.id, (await travelers.detail(builder, innerTraveler.id)).steps[0].id, {
    done: true,
    by: 'builder',
  });
  await findings.create(
    builder,
    {
      travelerId: innerTraveler.id,
      holeIds: ['U-09'],
      kind: 'hole_elongated',
      measurements: { holeDiameterIn: 0.141 },
      note: 'Hole looks oval after deburring, about a drill size long fore and aft.',
    },
    [{ buffer: await demoPhoto(), originalname: 'hole-u09.jpg' }],
  );
  if (opts.notice) {
    // Through the contract, as the form's would be: the demo's words keep to the limits people's do.
    const input = noticeInput.parse({ kitModelId: kit.id, ...DEMO_NOTICE, parts: [{ partDesignId: inner.id }] });
    await noticesService({ db, pool, mailQueue, storage, signer }).issue(supplier, input, []);
  }
  return true;
}

import express from 'express';
import request from 'supertest';
import { jpeg as greyJpeg } from '../helpers/photos';
import { DEMO_USERS } from '@/server/dev/seed';
import { devRouter } from '@/server/dev/dev-router';
import { findingMail, holePhotoCid, type FindingMailFacts } from '@/server/mail/finding-mail';
import { startSmtpFake, type SmtpFake } from '@/server/mail/smtp-fake';
import { createMailer, type Mailer } from '@/server/mail/transport';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';
import { raiseFinding } from '../helpers/raise-finding';

/**
 * A finding's mail carries the hole's photo as an inline part named by Content-ID, which the HTML shows
 * with a cid: link (RFC 2392; the multipart/related form of RFC 2387). A data: image in the HTML is what
 * many mail clients hide or strip, so none may be in what reaches the relay.
 */
jest.setTimeout(120000);

const jpeg = () => greyJpeg('#6a6a6a');

const facts = (thumbnail: Buffer | null): FindingMailFacts => ({
  findingId: '3f1e2d4c-0000-4000-8000-00000000beef',
  action: 'raise',
  toStatus: 'raised',
  disposition: null,
  note: 'shop head cracked',
  actorName: 'A. Builder',
  partNumber: 'T-1',
  partName: 'Test rib',
  letter: 'A',
  serial: 'T1-0001',
  kitSerial: 'KIT-1',
  holeIds: ['U-04'],
  kind: 'hole_cracked',
  repair: null,
  link: 'http://pitchcard.test/findings/x',
  thumbnail,
});

describe('the photo in a finding mail, as the SMTP relay receives it', () => {
  let fake: SmtpFake;
  let mailer: Mailer;
  beforeAll(async () => {
    fake = await startSmtpFake(0);
    mailer = createMailer({ host: '127.0.0.1', port: fake.port, from: 'pitchcard@shop.example', fake: true });
  });
  afterAll(async () => {
    mailer.close();
    await fake.close();
  });

  it("arrives as an inline part under the finding's Content-ID, named by a cid: link and never as a data: URL", async () => {
    const photo = await jpeg();
    const f = facts(photo);
    await mailer.send({ to: 'inspector@shop.example', ...findingMail(f) });
    const got = fake.messages[fake.messages.length - 1];
    const cid = holePhotoCid(f.findingId);
    expect(got.parts).toHaveLength(1);
    expect(got.parts[0]).toMatchObject({ cid, disposition: 'inline', contentType: 'image/jpeg' });
    expect(got.parts[0].content.equals(photo)).toBe(true);
    expect(got.html).toContain(`src="cid:${cid}"`);
    expect(got.html).not.toMatch(/data:/i);
  });

  it('sends no part and no image link when the finding has no photo to show', async () => {
    await mailer.send({ to: 'inspector@shop.example', ...findingMail(facts(null)) });
    const got = fake.messages[fake.messages.length - 1];
    expect(got.parts).toHaveLength(0);
    expect(got.html).not.toMatch(/<img|cid:|data:/i);
  });

  it('the development mail page gets the mail as sent, and a preview with the photo drawn in from its part', async () => {
    const photo = await jpeg();
    await mailer.send({ to: 'dev@shop.example', ...findingMail(facts(photo)) });
    const app = express().use('/api/dev', devRouter(fake));
    const res = await request(app).get('/api/dev/mail');
    expect(res.status).toBe(200);
    const newest = res.body[0];
    const cid = holePhotoCid(facts(null).findingId);
    expect(newest.html).toContain(`cid:${cid}`);
    expect(newest.attachments).toEqual([
      { cid, filename: 'hole.jpg', contentType: 'image/jpeg', disposition: 'inline', size: photo.length },
    ]);
    expect(newest.previewHtml).toContain(`src="data:image/jpeg;base64,${photo.toString('base64')}"`);
    expect(newest.previewHtml).not.toContain('cid:');
  });
});

describe('a finding raised with a photo, through the job queue', () => {
  let t: TestApp;
  let tok: Tokens;
  demoApp((s) => ({ t, tok } = s));

  it("mails the inspector the hole's photo inline by the finding's Content-ID", async () => {
    const list = await request(t.app).get('/api/travelers').set(auth(tok.builder));
    expect(list.status).toBe(200);
    const traveler = await request(t.app).get(`/api/travelers/${list.body.items[0].id}`).set(auth(tok.builder));
    const hole = traveler.body.holes.find((h: { status: string }) => h.status === 'pending');
    const res = await raiseFinding(t, tok.builder, {
      travelerId: traveler.body.id,
      holeIds: [hole.holeId],
      kind: 'hole_cracked',
      note: 'crack at the edge',
    }).attach('photos', await jpeg(), { filename: 'crack.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
    const mail = await t.waitForMail(
      (m) => m.to.includes(DEMO_USERS.inspector.email) && m.subject.includes(`hole ${hole.holeId}`),
    );
    const cid = holePhotoCid(res.body.id);
    expect(mail.parts.map((p) => [p.cid, p.disposition, p.contentType])).toEqual([[cid, 'inline', 'image/jpeg']]);
    expect(mail.html).toContain(`src="cid:${cid}"`);
    expect(mail.html).not.toMatch(/data:/i);
  });
});

import request from 'supertest';
import { auth, type TestApp } from './test-app';

/**
 * A finding raised through the API as the bench raises one: the part, its holes, a kind and a note, as
 * the multipart fields that come before the photos. Returned unsent: the test attaches what it sends
 * (and any further field), then awaits it.
 */
export const raiseFinding = (
  t: TestApp,
  token: string,
  f: { travelerId: string; holeIds: string[]; kind: string; note: string },
) =>
  request(t.app)
    .post('/api/findings')
    .set(auth(token))
    .field('travelerId', f.travelerId)
    .field('holeIds', JSON.stringify(f.holeIds))
    .field('kind', f.kind)
    .field('note', f.note);

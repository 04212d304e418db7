import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Jimp } from 'jimp';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { createShowcaseProject } from '../../factories/share.js';
import { writePhotoFiles } from '../../../server/lib/storage.js';

// The showcase hands out photo URLs; the photos work's /media route decides who may fetch them. These checks
// make sure the two agree: a shared page's photos load for a visitor, a private project's never do.
let t: TestContext;
let jpeg: Uint8Array;
beforeAll(async () => {
  t = await createTestContext();
  const image = new Jimp({ width: 40, height: 30, color: 0x3f6b4eff });
  jpeg = new Uint8Array(await image.getBuffer('image/jpeg'));
});
afterAll(() => t.close());

describe('photos on a showcase', () => {
  it('load for a signed-out visitor while shared, and stop at once when the project goes private', async () => {
    const owner = await signedInAgent(t.app, t.db);
    const p = await createShowcaseProject(t.db, owner.user.id, { visibility: 'link' });
    await writePhotoFiles(t.env.uploadsDir, p.id, p.coverKey, { display: jpeg, thumb: jpeg });

    const view = (await request(t.app).get(`/api/share/${p.token}`)).body.showcase;
    const cover = view.photos[0];
    const shown = await request(t.app).get(cover.url);
    expect(shown.status).toBe(200);
    expect(shown.headers['content-type']).toBe('image/jpeg');
    expect((await request(t.app).get(cover.thumbUrl)).status).toBe(200);

    await owner.agent.patch(`/api/projects/${p.id}`).send({ visibility: 'private' });
    expect((await request(t.app).get(cover.url)).status).toBe(404);
    expect((await request(t.app).get(cover.thumbUrl)).status).toBe(404);
    const stranger = await signedInAgent(t.app, t.db);
    expect((await stranger.agent.get(cover.url)).status).toBe(404);
    // The owner still sees their own photo.
    expect((await owner.agent.get(cover.url)).status).toBe(200);
  });
});

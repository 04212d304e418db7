import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { createShowcaseProject } from '../../factories/share.js';
import type { Mailer, MailMessage } from '../../../server/lib/mail.js';

// The e-mail goes through the real mailer: nodemailer over SMTP to the built-in local fake, read back from its outbox.
let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

const outbox = async () => (await t.mailer.outbox!()) ?? [];
const hourAgo = (minutes = 61) => new Date(Date.now() - minutes * 60_000).toISOString();

describe('comment e-mails to the page owner', () => {
  it('arrive in the local outbox with the comment and an absolute link to the page', async () => {
    const owner = await signedInAgent(t.app, t.db, { displayName: 'Maker Mae' });
    const p = await createShowcaseProject(t.db, owner.user.id, { title: 'Pebble <the> owl' });
    const friend = await signedInAgent(t.app, t.db, { displayName: 'Friend Flo' });
    const before = (await outbox()).length;
    const res = await friend.agent.post(`/api/share/${p.token}/comments`).set('Host', 'whorl.test:4321').send({ body: 'Those <em>ears</em>!' });
    expect(res.status).toBe(201);
    const mails = (await outbox()).slice(before);
    expect(mails).toHaveLength(1);
    const mail = mails[0]!;
    expect(mail.to).toBe(owner.user.email);
    expect(mail.subject).toBe('Friend Flo commented on “Pebble <the> owl”');
    expect(mail.text).toContain('Those <em>ears</em>!');
    expect(mail.text).toContain(`http://whorl.test:4321/p/${p.token}#comments`);
    // In the HTML part the comment is text, not markup.
    expect(mail.html).toContain('Those &lt;em&gt;ears&lt;/em&gt;!');
    expect(mail.html).not.toContain('<em>ears</em>');
    // The commenter's address is never in it.
    expect(`${mail.text}${mail.html}`).not.toContain(friend.user.email);
  });

  it('sends at most one an hour per project', async () => {
    const owner = await signedInAgent(t.app, t.db);
    const p = await createShowcaseProject(t.db, owner.user.id);
    const other = await createShowcaseProject(t.db, owner.user.id);
    const friend = await signedInAgent(t.app, t.db);
    const before = (await outbox()).length;
    await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'First' });
    await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Second' });
    await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Third' });
    expect((await outbox()).slice(before).map((m) => m.text.includes('First'))).toEqual([true]);
    // Another project has its own hour.
    await friend.agent.post(`/api/share/${other.token}/comments`).send({ body: 'Elsewhere' });
    expect((await outbox()).length - before).toBe(2);
    // Once the hour has passed, the next comment sends again.
    await t.db('projects').where({ id: p.id }).update({ last_comment_mail_at: hourAgo() });
    await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'An hour later' });
    const after = (await outbox()).slice(before);
    expect(after).toHaveLength(3);
    expect(after[2]!.text).toContain('An hour later');
  });

  it('is not sent for the owner’s own comments, nor when the owner turned the setting off', async () => {
    const owner = await signedInAgent(t.app, t.db);
    const p = await createShowcaseProject(t.db, owner.user.id);
    const friend = await signedInAgent(t.app, t.db);
    const before = (await outbox()).length;
    await owner.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Thanks all!' });
    expect((await outbox()).length).toBe(before);
    await owner.agent.patch('/api/share-settings').send({ notifyComments: false });
    await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Gorgeous' });
    expect((await outbox()).length).toBe(before);
    await owner.agent.patch('/api/share-settings').send({ notifyComments: true });
    await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Still gorgeous' });
    expect((await outbox()).length).toBe(before + 1);
  });
});

describe('when the mail server fails', () => {
  it('keeps the comment and lets the next comment try the e-mail again', async () => {
    const sent: MailMessage[] = [];
    let fail = true;
    const flaky: Mailer = {
      async send(m) {
        if (fail) throw new Error('connection refused');
        sent.push(m);
      },
      async close() {},
    };
    const t2 = await createTestContext({}, { mailer: flaky });
    try {
      const owner = await signedInAgent(t2.app, t2.db);
      const p = await createShowcaseProject(t2.db, owner.user.id);
      const friend = await signedInAgent(t2.app, t2.db);
      expect((await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'One' })).status).toBe(201);
      expect(sent).toHaveLength(0);
      fail = false;
      await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Two' });
      expect(sent).toHaveLength(1);
      expect(sent[0]!.text).toContain('Two');
    } finally {
      await t2.close();
    }
  });
});

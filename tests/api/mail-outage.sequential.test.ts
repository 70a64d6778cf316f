import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureTestRegion, messagesTo, setMailOutage, validSubmission, waitForMessages } from '../support/fixtures';
import { appFetch } from '../support/stack';
import { closeDb } from '../../src/db/client';

describe('an e-mail outage during submission', () => {
  beforeAll(async () => {
    await ensureTestRegion();
  });
  afterAll(async () => {
    await setMailOutage(false);
    await closeDb();
  });

  it('still stores the assessment, and the mail arrives once the service is back', async () => {
    await setMailOutage(true);
    const input = validSubmission();
    const response = await appFetch('/api/assessments', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(input),
    });
    expect(response.status).toBe(201);

    // The worker has tried (and been refused) several times while the service is down.
    await new Promise((r) => setTimeout(r, 5_000));
    expect(await messagesTo(input.contact.email)).toHaveLength(0);

    await setMailOutage(false);
    const arrived = await waitForMessages(input.contact.email, (m) => m.length > 0, 90_000);
    expect(arrived).toHaveLength(1);
    expect(arrived[0]!.subject).toMatch(/Your Lagwise assessment LW-/);
  });
});

import { describe, expect, it } from 'vitest';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';
import { buildComment, buildShowcase, TOKEN, XSS } from './fixtures';
import type { Showcase, ShowcaseComment } from '@/types/showcase';

const signedOut = http.get('*/api/auth/me', () => HttpResponse.json({ error: 'Please sign in to continue.' }, { status: 401 }));

function serve(showcase: Showcase, comments: ShowcaseComment[] = [buildComment()]) {
  server.use(
    signedOut,
    http.get(`*/api/share/${TOKEN}`, () => HttpResponse.json({ showcase })),
    http.get(`*/api/share/${TOKEN}/comments`, () => HttpResponse.json({ comments })),
  );
}

describe('the showcase for a signed-out visitor', () => {
  it('shows the piece: cover, title, maker, facts, credit, materials, pieces, placements, changes and the caution', async () => {
    serve(buildShowcase());
    const { container } = renderRoute(`/p/${TOKEN}`);
    expect(await screen.findByRole('heading', { level: 1, name: 'Pip the pocket owl' })).toBeInTheDocument();
    expect(screen.getByRole('img', { name: 'Pip on a shelf' })).toHaveAttribute('src', '/media/photos/aaaaaaaaaaaaaaaaaaaaaaaa/display.jpg');
    expect(screen.getByText('Hazel Brook')).toBeInTheDocument();
    expect(screen.getByText('2 h 35 min')).toBeInTheDocument();
    expect(screen.getByText('20 Nov 2026')).toBeInTheDocument();

    const credit = screen.getByRole('link', { name: /Where to find the pattern/ });
    expect(credit).toHaveAttribute('href', 'https://patterns.example/owl');
    expect(credit).toHaveAttribute('rel', 'noopener nofollow ugc');
    expect(screen.getByText('Designed by Fern & Feather')).toBeInTheDocument();

    const materials = screen.getByRole('region', { name: 'Materials' });
    expect(within(materials).getByText('1.5 skeins used', { exact: false })).toBeInTheDocument();
    expect(within(materials).getByText('≈ DK, Light (3) · 40 m (44 yd) used')).toBeInTheDocument();
    expect(within(materials).getByText('(US E-4)')).toBeInTheDocument();
    expect(within(materials).getByText('Safety eyes, 8 mm × 2')).toBeInTheDocument();

    expect(screen.getByText('Left eye: Body, between Rnds 9 and 10, at stitch 14')).toBeInTheDocument();
    expect(within(screen.getByRole('region', { name: 'Changes from the pattern' })).getByText('Used a 3.25 mm hook for Rnds 7–12.')).toBeInTheDocument();
    expect(screen.getByRole('alert')).toHaveTextContent('Small parts can be a choking hazard');
    // The journal's Markdown is rendered, its HTML never.
    expect(within(screen.getByRole('region', { name: 'From the journal' })).getByText('so round').tagName).toBe('STRONG');
    expect(document.title).toBe('Pip the pocket owl by Hazel Brook · Whorlbook');
    expect(container.textContent).not.toMatch(/@[a-z0-9-]+\.[a-z]{2,}/i);
  });

  it('renders a comment with markup as plain text, never as an element', async () => {
    serve(buildShowcase());
    const { container } = renderRoute(`/p/${TOKEN}`);
    expect(await screen.findByText(XSS)).toBeInTheDocument();
    expect(screen.getByTestId('comment-body').textContent).toBe(XSS);
    expect(container.querySelector('img[src="x"]')).toBeNull();
    expect(container.querySelector('[onerror]')).toBeNull();
  });

  it('asks a visitor to sign in to comment, cheer or report, and comes back to the page afterwards', async () => {
    serve(buildShowcase());
    const { router } = renderRoute(`/p/${TOKEN}`);
    const prompt = await screen.findByRole('link', { name: 'Sign in to comment' });
    expect(prompt).toHaveAttribute('href', `/sign-in?next=${encodeURIComponent(`/p/${TOKEN}`)}`);
    expect(screen.queryByLabelText('Leave a comment')).toBeNull();
    expect(screen.getByRole('link', { name: /Sign in to report this page/ })).toBeInTheDocument();
    await userEvent.setup().click(screen.getByRole('button', { name: /Cheer/ }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(router.state.location.search).toBe(`?next=${encodeURIComponent(`/p/${TOKEN}`)}`);
  });

  it('says the page is not shared when the link is private, retired or unknown', async () => {
    server.use(signedOut, http.get(`*/api/share/${TOKEN}`, () => HttpResponse.json({ error: 'That page could not be found.' }, { status: 404 })));
    renderRoute(`/p/${TOKEN}`);
    expect(await screen.findByText('This page is not shared')).toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Pip the pocket owl' })).toBeNull();
  });

  it('opens photos full-screen and moves on with a swipe or the arrows', async () => {
    serve(buildShowcase());
    renderRoute(`/p/${TOKEN}`);
    await userEvent.setup().click(await screen.findByRole('button', { name: /Enlarge the cover photo/ }));
    expect(screen.getByText('Photo 1 of 3')).toBeInTheDocument();
    const stage = screen.getByTestId('lightbox-stage');
    // A swipe to the left shows the next photo.
    fireEvent.pointerDown(stage, { pointerId: 1, clientX: 300, clientY: 400, button: 0 });
    fireEvent.pointerMove(stage, { pointerId: 1, clientX: 200, clientY: 405 });
    fireEvent.pointerUp(stage, { pointerId: 1, clientX: 120, clientY: 410 });
    expect(screen.getByText('Photo 2 of 3')).toBeInTheDocument();
    expect(screen.getByRole('img', { name: 'The wings' })).toBeInTheDocument();
    // A short drag is a tap, not a swipe.
    fireEvent.pointerDown(stage, { pointerId: 2, clientX: 200, clientY: 400, button: 0 });
    fireEvent.pointerUp(stage, { pointerId: 2, clientX: 180, clientY: 400 });
    expect(screen.getByText('Photo 2 of 3')).toBeInTheDocument();
    // A swipe to the right goes back; from the first photo the arrow wraps to the last.
    fireEvent.pointerDown(stage, { pointerId: 3, clientX: 100, clientY: 400, button: 0 });
    fireEvent.pointerUp(stage, { pointerId: 3, clientX: 260, clientY: 400 });
    expect(screen.getByText('Photo 1 of 3')).toBeInTheDocument();
    await userEvent.setup().click(screen.getByRole('button', { name: 'Previous photo' }));
    expect(screen.getByText('Photo 3 of 3')).toBeInTheDocument();
  });
});

describe('the showcase for a signed-in friend', () => {
  it('posts a comment, shows the server’s sentence when it is refused, and cheers', async () => {
    const comments: ShowcaseComment[] = [];
    const posted: string[] = [];
    let cheers = { count: 2, cheered: false };
    server.use(
      http.get(`*/api/share/${TOKEN}`, () => HttpResponse.json({ showcase: buildShowcase({ viewer: { signedIn: true, isOwner: false, ownerProjectId: null }, cheers, commentCount: comments.length }) })),
      http.get(`*/api/share/${TOKEN}/comments`, () => HttpResponse.json({ comments })),
      http.post(`*/api/share/${TOKEN}/comments`, async ({ request }) => {
        const { body } = (await request.json()) as { body: string };
        posted.push(body);
        if (body.includes('too much')) return HttpResponse.json({ error: 'You have left a lot of comments in a short time. Wait 9 minutes and try again.' }, { status: 429 });
        const c = buildComment({ id: comments.length + 1, body, author: { displayName: 'Me' }, mine: true, canDelete: true });
        comments.push(c);
        return HttpResponse.json({ comment: c }, { status: 201 });
      }),
      http.post(`*/api/share/${TOKEN}/cheer`, () => {
        cheers = { count: cheers.count + (cheers.cheered ? 0 : 1), cheered: true };
        return HttpResponse.json({ cheers });
      }),
    );
    renderRoute(`/p/${TOKEN}`);
    const user = userEvent.setup();
    const box = await screen.findByLabelText('Leave a comment');
    await user.type(box, 'What a round owl!');
    expect(screen.getByText('17 of 2,000 characters · plain text')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Post comment' }));
    expect(await screen.findByText('What a round owl!')).toBeInTheDocument();
    expect(posted).toEqual(['What a round owl!']);
    await waitFor(() => expect(box).toHaveValue(''));

    await user.type(box, 'too much');
    await user.click(screen.getByRole('button', { name: 'Post comment' }));
    expect(await screen.findByText(/Wait 9 minutes/)).toBeInTheDocument();

    const cheer = screen.getByRole('button', { name: /Cheer/ });
    expect(cheer).toHaveAttribute('aria-pressed', 'false');
    await user.click(cheer);
    const cheered = await screen.findByRole('button', { name: /You cheered/ });
    expect(cheered).toHaveAttribute('aria-pressed', 'true');
    expect(within(cheered).getByLabelText('3 cheers so far')).toBeInTheDocument();
  });

  it('checks the 2,000-character limit with the shared schema before sending', async () => {
    let sent = false;
    server.use(
      http.get(`*/api/share/${TOKEN}`, () => HttpResponse.json({ showcase: buildShowcase({ viewer: { signedIn: true, isOwner: false, ownerProjectId: null } }) })),
      http.get(`*/api/share/${TOKEN}/comments`, () => HttpResponse.json({ comments: [] })),
      http.post(`*/api/share/${TOKEN}/comments`, () => {
        sent = true;
        return HttpResponse.json({}, { status: 500 });
      }),
    );
    renderRoute(`/p/${TOKEN}`);
    const box = await screen.findByLabelText('Leave a comment');
    fireEvent.change(box, { target: { value: 'x'.repeat(2001) } });
    await userEvent.setup().click(screen.getByRole('button', { name: 'Post comment' }));
    expect(await screen.findByText(/at most 2,000 characters; this one has 2,001/)).toBeInTheDocument();
    expect(sent).toBe(false);
  });

  it('lets the owner hide a comment and tells them it is hidden', async () => {
    let hidden = false;
    server.use(
      http.get(`*/api/share/${TOKEN}`, () => HttpResponse.json({ showcase: buildShowcase({ viewer: { signedIn: true, isOwner: true, ownerProjectId: 7 } }) })),
      http.get(`*/api/share/${TOKEN}/comments`, () => HttpResponse.json({ comments: [buildComment({ body: 'Rude words', canDelete: true, canHide: true, hidden })] })),
      // Comments are changed through the page's own link, never by id alone.
      http.patch(`*/api/share/${TOKEN}/comments/1`, async ({ request }) => {
        hidden = ((await request.json()) as { hidden: boolean }).hidden;
        return HttpResponse.json({ comment: buildComment({ body: 'Rude words', canHide: true, canDelete: true, hidden }) });
      }),
    );
    renderRoute(`/p/${TOKEN}`);
    expect(await screen.findByText('This is your page')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /Project/ })).toHaveAttribute('href', '/projects/7');
    await userEvent.setup().click(await screen.findByRole('button', { name: 'Hide' }));
    expect(await screen.findByText('Hidden. Only you can see it.')).toBeInTheDocument();
    expect(hidden).toBe(true);
    expect(screen.getByRole('button', { name: 'Show again' })).toBeInTheDocument();
  });

  it('lets the owner delete a comment, through the page’s link', async () => {
    let comments = [buildComment({ body: 'Off-topic', canDelete: true, canHide: true })];
    const deleted: string[] = [];
    server.use(
      http.get(`*/api/share/${TOKEN}`, () => HttpResponse.json({ showcase: buildShowcase({ viewer: { signedIn: true, isOwner: true, ownerProjectId: 7 } }) })),
      http.get(`*/api/share/${TOKEN}/comments`, () => HttpResponse.json({ comments })),
      http.delete(`*/api/share/${TOKEN}/comments/:id`, ({ params }) => {
        deleted.push(String(params.id));
        comments = [];
        return new HttpResponse(null, { status: 204 });
      }),
    );
    renderRoute(`/p/${TOKEN}`);
    const user = userEvent.setup();
    expect(await screen.findByText('Off-topic')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Delete' }));
    await user.click(screen.getByRole('button', { name: 'Delete comment' }));
    expect(await screen.findByText(/No comments yet/)).toBeInTheDocument();
    expect(deleted).toEqual(['1']);
  });

  it('reports a comment or the page with the page’s link, so the server can check the comment is on it', async () => {
    const reports: unknown[] = [];
    server.use(
      http.get(`*/api/share/${TOKEN}`, () => HttpResponse.json({ showcase: buildShowcase({ viewer: { signedIn: true, isOwner: false, ownerProjectId: null } }) })),
      http.get(`*/api/share/${TOKEN}/comments`, () => HttpResponse.json({ comments: [buildComment({ id: 42, body: 'Buy cheap yarn here' })] })),
      http.post('*/api/reports', async ({ request }) => {
        const body = await request.json();
        reports.push(body);
        if (reports.length === 1) return HttpResponse.json({ error: 'That comment could not be found.' }, { status: 404 });
        return HttpResponse.json({ report: { id: reports.length, status: 'open' } }, { status: 201 });
      }),
    );
    renderRoute(`/p/${TOKEN}`);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Report the comment by Robin Vale' }));
    expect(screen.getByRole('heading', { name: 'Report this comment' })).toBeInTheDocument();
    await user.type(screen.getByLabelText('What is wrong?'), 'Advertising');
    await user.click(screen.getByRole('button', { name: 'Send report' }));
    // The server's sentence stays beside the box when it refuses.
    expect(await screen.findByText('That comment could not be found.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Send report' }));
    await waitFor(() => expect(screen.queryByRole('heading', { name: 'Report this comment' })).toBeNull());

    await user.click(screen.getByRole('button', { name: 'Report this page' }));
    await user.type(screen.getByLabelText('What is wrong?'), 'Copied photos');
    await user.click(screen.getByRole('button', { name: 'Send report' }));
    await waitFor(() => expect(screen.queryByRole('heading', { name: 'Report this page' })).toBeNull());

    expect(reports).toEqual([
      { shareToken: TOKEN, commentId: 42, reason: 'Advertising' },
      { shareToken: TOKEN, commentId: 42, reason: 'Advertising' },
      { shareToken: TOKEN, reason: 'Copied photos' },
    ]);
  });
});

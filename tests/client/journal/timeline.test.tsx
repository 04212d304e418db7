import { describe, expect, it } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { http, HttpResponse } from 'msw';
import { createQueryClient } from '@/lib/query-client';
import { JournalTimeline } from '@/features/journal/components/journal-timeline';
import type { JournalEntry } from '@/types/api';
import { server } from '../mocks/server';

const pieces = [
  { id: 11, name: 'Body' },
  { id: 12, name: 'Ear' },
];

const photo = (id: number, entryId: number, alt: string, cover = false) => ({
  id,
  entryId,
  url: `/media/photos/key${id}aaaaaaaaaaaaaaaaaaa/display.jpg`,
  thumbUrl: `/media/photos/key${id}aaaaaaaaaaaaaaaaaaa/thumb.jpg`,
  width: 1600,
  height: 1200,
  alt,
  cover,
});

const entry = (over: Partial<JournalEntry>): JournalEntry => ({
  id: 1,
  projectId: 7,
  pieceId: null,
  pieceName: null,
  body: 'A note',
  entryDate: '2026-11-20',
  minutes: null,
  tags: [],
  onShowcase: false,
  photos: [],
  createdAt: '2026-11-20T10:00:00.000Z',
  updatedAt: '2026-11-20T10:00:00.000Z',
  ...over,
});

const entries = [
  entry({
    id: 2,
    pieceId: 12,
    pieceName: 'Ear',
    entryDate: '2026-11-25',
    minutes: 75,
    tags: ['placement', 'change'],
    body: 'Placed the ear at **Rnd 9**. <script>window.__pwned = true</script><b class="raw">raw html</b>\n\n![tracker](https://elsewhere.example/pixel.png)\n\n[the designer’s notes](https://example.com/notes)',
    photos: [photo(31, 2, 'Ear — 25 Nov 2026', true), photo(32, 2, 'Ear from the side')],
  }),
  entry({ id: 1, pieceId: 11, pieceName: 'Body', entryDate: '2026-11-20', body: 'Body started', tags: ['progress'] }),
];

function renderTimeline(path = '/projects/7', options: Parameters<typeof userEvent.setup>[0] = {}) {
  const qc = createQueryClient();
  let coverChanges = 0;
  render(
    <QueryClientProvider client={qc}>
      <MemoryRouter initialEntries={[path]}>
        <JournalTimeline projectId={7} pieces={pieces} onCoverChange={() => (coverChanges += 1)} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return { user: userEvent.setup(options), coverChanges: () => coverChanges };
}

describe('the journal timeline', () => {
  it('shows entries newest first with day, piece, time, tags in words, safe Markdown and thumbnails', async () => {
    server.use(http.get('*/api/projects/7/entries', () => HttpResponse.json({ entries })));
    renderTimeline();
    const list = await screen.findByRole('list', { name: 'Journal entries, newest first' });
    const items = within(list).getAllByRole('listitem').filter((li) => li.parentElement === list);
    expect(items.map((li) => within(li).getByRole('heading').textContent)).toEqual(['25 Nov 2026', '20 Nov 2026']);
    const first = within(items[0]);
    expect(first.getByText('1 h 15 min')).toBeInTheDocument();
    expect(first.getByText('Ear')).toBeInTheDocument();
    expect(first.getByText('Placement')).toBeInTheDocument();
    expect(first.getByText('Change from the pattern')).toBeInTheDocument();
    // Markdown renders; raw HTML and remote images do not.
    expect(first.getByText('Rnd 9').tagName).toBe('STRONG');
    expect(items[0].querySelector('script')).toBeNull();
    expect(items[0].querySelector('b.raw')).toBeNull();
    // (Only the tags go: the words between them stay as plain text.)
    expect(first.getByText(/raw html/).tagName).toBe('P');
    expect(items[0].querySelector('img[src*="elsewhere.example"]')).toBeNull();
    expect((window as { __pwned?: boolean }).__pwned).toBeUndefined();
    expect(first.getByRole('link', { name: 'the designer’s notes' })).toHaveAttribute('rel', expect.stringContaining('noopener'));
    // Thumbnails carry their alt text; the cover says so in words.
    const thumbs = first.getAllByRole('button', { name: /^Open photo:/ });
    expect(thumbs.map((b) => b.querySelector('img')!.getAttribute('alt'))).toEqual(['Ear — 25 Nov 2026', 'Ear from the side']);
    expect(thumbs[0].querySelector('img')).toHaveAttribute('src', '/media/photos/key31aaaaaaaaaaaaaaaaaaa/thumb.jpg');
    expect(first.getByText('Cover')).toBeInTheDocument();
  });

  it('filters by piece through the API', async () => {
    const asked: Array<string | null> = [];
    server.use(
      http.get('*/api/projects/7/entries', ({ request }) => {
        const pieceId = new URL(request.url).searchParams.get('pieceId');
        asked.push(pieceId);
        return HttpResponse.json({ entries: pieceId ? entries.filter((e) => e.pieceId === Number(pieceId)) : entries });
      }),
    );
    const { user } = renderTimeline();
    await screen.findByText('Body started');
    await user.selectOptions(screen.getByLabelText('Show entries for'), 'Body');
    await waitFor(() => expect(screen.queryByText(/Placed the ear/)).not.toBeInTheDocument());
    expect(screen.getByText('Body started')).toBeInTheDocument();
    expect(asked).toEqual([null, '11']);
  });

  it('says so when there are no entries yet', async () => {
    server.use(http.get('*/api/projects/7/entries', () => HttpResponse.json({ entries: [] })));
    renderTimeline();
    expect(await screen.findByText('No entries yet')).toBeInTheDocument();
  });

  it('writes an entry, then sends each photo on its own and shows the server’s sentence for a refused one', async () => {
    let list: JournalEntry[] = [];
    let posted: unknown = null;
    const uploads: string[] = [];
    server.use(
      http.get('*/api/projects/7/entries', () => HttpResponse.json({ entries: list })),
      http.post('*/api/projects/7/entries', async ({ request }) => {
        posted = await request.json();
        const made = entry({ id: 9, body: (posted as { body: string }).body, entryDate: '2026-11-26' });
        list = [made];
        return HttpResponse.json({ entry: made }, { status: 201 });
      }),
      http.post('*/api/entries/9/photos', async ({ request }) => {
        const form = await request.formData();
        const file = form.get('photos') as File;
        uploads.push(file.name);
        if (file.name.startsWith('notes')) {
          return HttpResponse.json({ error: `“${file.name}” is not a photo Whorlbook can read: its contents are not an image, whatever its name says. Photos work as JPEG, PNG or WebP.` }, { status: 415 });
        }
        list = [{ ...list[0], photos: [photo(40, 9, 'Whole project — 26 Nov 2026')] }];
        return HttpResponse.json({ photos: [photo(40, 9, 'Whole project — 26 Nov 2026')] }, { status: 201 });
      }),
    );
    const { user } = renderTimeline();
    await screen.findByText('No entries yet');
    await user.click(screen.getByRole('button', { name: 'Write an entry' }));
    await user.type(screen.getByLabelText('What did you do?'), 'Stuffed the body');
    await user.upload(screen.getByLabelText('Photo files'), [
      new File([new Uint8Array([0xff, 0xd8, 0xff, 0xe0])], 'stuffed.jpg', { type: 'image/jpeg' }),
      new File([new Uint8Array([0xff, 0xd8, 0xff, 0xe0])], 'notes.jpg', { type: 'image/jpeg' }),
    ]);
    await user.click(screen.getByRole('button', { name: 'Save entry' }));

    const panel = await screen.findByRole('region', { name: 'Photos on their way' });
    expect(within(panel).getByText('stuffed.jpg')).toBeInTheDocument();
    expect(await within(panel).findByText(/“notes\.jpg” is not a photo/)).toBeInTheDocument();
    expect(within(panel).getByText('Not added')).toBeInTheDocument();
    await waitFor(() => expect(within(panel).getByText('Added')).toBeInTheDocument());
    expect(await screen.findByRole('button', { name: 'Open photo: Whole project — 26 Nov 2026' })).toBeInTheDocument();
    expect(posted).toMatchObject({ body: 'Stuffed the body', pieceId: null, tags: [] });
    expect(uploads.sort()).toEqual(['notes.jpg', 'stuffed.jpg']);
    // A refusal stays until the maker clears it.
    await user.click(within(panel).getByRole('button', { name: 'Clear this list' }));
    expect(screen.queryByRole('region', { name: 'Photos on their way' })).not.toBeInTheDocument();
  });

  it('refuses a non-photo before sending it', async () => {
    let sent = 0;
    server.use(
      http.get('*/api/projects/7/entries', () => HttpResponse.json({ entries: [entry({ id: 5 })] })),
      http.patch('*/api/entries/5', async ({ request }) => HttpResponse.json({ entry: entry({ id: 5, ...((await request.json()) as object) }) })),
      http.post('*/api/entries/5/photos', () => {
        sent += 1;
        return HttpResponse.json({ photos: [] }, { status: 201 });
      }),
    );
    // A dropped file skips the picker's accept="image/*" filter, so the form must check it itself.
    const { user } = renderTimeline('/projects/7', { applyAccept: false });
    await user.click(await screen.findByRole('button', { name: 'Edit the entry of 20 Nov 2026' }));
    await user.upload(screen.getByLabelText('Photo files'), new File(['%PDF-1.7'], 'pattern.pdf', { type: 'application/pdf' }));
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText('“pattern.pdf” is not a photo. Photos work as JPEG, PNG or WebP.')).toBeInTheDocument();
    expect(sent).toBe(0);
  });

  it('opens a photo larger, edits its description and makes it the cover', async () => {
    const patches: unknown[] = [];
    server.use(
      http.get('*/api/projects/7/entries', () => HttpResponse.json({ entries })),
      http.patch('*/api/photos/32', async ({ request }) => {
        const body = await request.json();
        patches.push(body);
        return HttpResponse.json({ photo: photo(32, 2, 'Ear from the side'), cover: Boolean((body as { cover?: boolean }).cover) });
      }),
    );
    const { user, coverChanges } = renderTimeline();
    await user.click(await screen.findByRole('button', { name: 'Open photo: Ear from the side' }));
    const dialog = screen.getByRole('dialog', { name: 'Photo' });
    expect(within(dialog).getByRole('img', { name: 'Ear from the side' })).toHaveAttribute('src', '/media/photos/key32aaaaaaaaaaaaaaaaaaa/display.jpg');
    const field = within(dialog).getByLabelText('Description for people who cannot see the photo');
    await user.clear(field);
    await user.click(within(dialog).getByRole('button', { name: 'Save description' }));
    expect(await within(dialog).findByText(/Describe the photo in a few words/)).toBeInTheDocument();
    await user.type(field, 'The left ear, pinned before sewing');
    await user.click(within(dialog).getByRole('button', { name: 'Save description' }));
    await user.click(within(dialog).getByRole('button', { name: 'Use as cover' }));
    await waitFor(() => expect(patches).toEqual([{ alt: 'The left ear, pinned before sewing' }, { cover: true }]));
    await waitFor(() => expect(coverChanges()).toBe(1));
  });

  it('deletes an entry after asking', async () => {
    let deleted: string | null = null;
    server.use(
      http.get('*/api/projects/7/entries', () => HttpResponse.json({ entries: deleted ? entries.slice(1) : entries })),
      http.delete('*/api/entries/:id', ({ params }) => {
        deleted = String(params.id);
        return new HttpResponse(null, { status: 204 });
      }),
    );
    const { user } = renderTimeline();
    await user.click(await screen.findByRole('button', { name: 'Delete the entry of 25 Nov 2026' }));
    expect(screen.getByText(/and its 2 photos go for good/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Delete the entry' }));
    await waitFor(() => expect(screen.queryByText(/Placed the ear/)).not.toBeInTheDocument());
    expect(deleted).toBe('2');
  });

  it('opens the form prefilled from a Tally link (?journal=new&minutes=…&piece=…)', async () => {
    server.use(http.get('*/api/projects/7/entries', () => HttpResponse.json({ entries: [] })));
    renderTimeline('/projects/7?journal=new&minutes=28&piece=12');
    expect(await screen.findByLabelText('Working time (minutes)')).toHaveValue(28);
    expect(screen.getByLabelText('Piece')).toHaveValue('12');
  });
});

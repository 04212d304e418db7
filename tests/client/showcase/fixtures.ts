import type { Showcase, ShowcaseComment } from '@/types/showcase';

// A showcase of our own, shaped exactly like GET /api/share/:token answers.
export const TOKEN = 'tok_abcdefghijklmnopqrstuv';

export function buildShowcase(overrides: Partial<Showcase> = {}): Showcase {
  return {
    token: TOKEN,
    url: `http://127.0.0.1:3000/p/${TOKEN}`,
    visibility: 'link',
    title: 'Pip the pocket owl',
    status: 'finished',
    statusLabel: 'Finished',
    startedOn: '2026-11-02',
    finishedOn: '2026-11-20',
    workingMinutes: 155,
    maker: { displayName: 'Hazel Brook', profileUrl: null },
    pattern: { title: 'Round owl', designerCredit: 'Fern & Feather', sourceUrl: 'https://patterns.example/owl' },
    materials: {
      yarns: [
        { name: 'Cotton 8', colour: 'Moss', fibre: 'cotton', weight: { category: 3, label: 'DK, Light (3)', approximate: false }, amount: '1.5 skeins' },
        { name: 'Soft acrylic', colour: null, fibre: null, weight: { category: 3, label: 'DK, Light (3)', approximate: true }, amount: '40 m (44 yd)' },
      ],
      hooks: [{ mm: 3.5, us: 'E-4', note: null }],
      notions: [{ kind: 'safety_eyes', label: 'Safety eyes', sizeMm: 8, quantity: 2, note: null }],
    },
    pieces: [
      { name: 'Body', copies: 1 },
      { name: 'Wing', copies: 2 },
    ],
    placements: [{ label: 'Left eye', piece: 'Body', copy: 1, copies: 1, round: 10, step: 14, note: null, text: 'Left eye: Body, between Rnds 9 and 10, at stitch 14' }],
    changes: [{ id: 3, date: '2026-11-07', body: 'Used a 3.25 mm hook for Rnds 7–12.' }],
    journal: [{ id: 1, date: '2026-11-05', body: 'Body done, **so round**.', minutes: 60, tags: ['progress'] }],
    photos: [
      { id: 11, url: '/media/photos/aaaaaaaaaaaaaaaaaaaaaaaa/display.jpg', thumbUrl: '/media/photos/aaaaaaaaaaaaaaaaaaaaaaaa/thumb.jpg', width: 1600, height: 1200, alt: 'Pip on a shelf', cover: true },
      { id: 12, url: '/media/photos/bbbbbbbbbbbbbbbbbbbbbbbb/display.jpg', thumbUrl: '/media/photos/bbbbbbbbbbbbbbbbbbbbbbbb/thumb.jpg', width: 1200, height: 1600, alt: 'The wings', cover: false },
      { id: 13, url: '/media/photos/cccccccccccccccccccccccc/display.jpg', thumbUrl: '/media/photos/cccccccccccccccccccccccc/thumb.jpg', width: 1600, height: 1200, alt: 'Eyes placed', cover: false },
    ],
    cautions: [{ code: 'small-parts', title: 'Small parts can be a choking hazard', message: 'This uses safety eyes.' }],
    cheers: { count: 2, cheered: false },
    commentCount: 1,
    viewer: { signedIn: false, isOwner: false, ownerProjectId: null },
    ...overrides,
  };
}

export const XSS = '<img src=x onerror=alert(1)>';

export function buildComment(overrides: Partial<ShowcaseComment> = {}): ShowcaseComment {
  return {
    id: 1,
    body: XSS,
    author: { displayName: 'Robin Vale' },
    createdAt: new Date().toISOString(),
    hidden: false,
    hiddenByAdmin: false,
    mine: false,
    canDelete: false,
    canHide: false,
    ...overrides,
  };
}

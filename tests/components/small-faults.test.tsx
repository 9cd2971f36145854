import * as ImagePicker from 'expo-image-picker';
import type { TravelerDetail } from '@/db/contracts';
import { FlagScreen } from '@/components/findings/flag-screen';
import { isPhotoBytes, notPhotosMessage, pickPhotos } from '@/components/findings/photo-picker';
import { mayOpen, mayOpenPath } from '@/components/navigation/role-tabs';
import { tabLabelFit } from '@/components/navigation/tab-label';
import { DraftTiles } from '@/components/ui/draft-tiles';
import { Notice } from '@/components/ui/states';
import { Mono, Txt, valueGroups } from '@/components/ui/text';
import { fonts } from '@/constants/theme';
import { storageKeys } from '@/lib/storage';
import { holeU, standardTraveler, upperFlangeOf } from '../fixtures/traveler';
import { recordFetch, wrap } from './finding-fixtures';
import { renderWeb } from './render-web';

jest.mock('expo-image-picker', () => ({
  launchImageLibraryAsync: jest.fn(),
  launchCameraAsync: jest.fn(),
  requestCameraPermissionsAsync: jest.fn(async () => ({ granted: true })),
}));
jest.mock('expo-router', () => jest.requireActual('../helpers/expo-router-stub'));
jest.mock('@/hooks/use-wide', () => ({ useWide: () => false }));

const library = ImagePicker.launchImageLibraryAsync as jest.Mock;

// First bytes of each format, from its own specification:
const signatures = {
  // ITU-T T.81 (JPEG) B.1.1.2: SOI marker FF D8, then the next marker (APP0 FF E0 for JFIF).
  jpeg: [0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46, 0x49, 0x46, 0, 1],
  // W3C PNG (Second Edition) 5.2: the eight-byte signature.
  png: [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d],
  // GIF89a specification, 17. Header: "GIF" and the version "89a".
  gif: [...'GIF89a'].map((c) => c.charCodeAt(0)),
  // WebP container specification: a RIFF file whose form type is "WEBP".
  webp: [...'RIFF']
    .map((c) => c.charCodeAt(0))
    .concat(
      [0x24, 0, 0, 0],
      [...'WEBP'].map((c) => c.charCodeAt(0)),
    ),
  // TIFF 6.0, section 2: "II" then 42 (little-endian).
  tiff: [0x49, 0x49, 0x2a, 0x00],
  // ISO/IEC 23008-12 (HEIF): an ftyp box whose major brand is "heic".
  heic: [0, 0, 0, 0x18].concat([...'ftypheic'].map((c) => c.charCodeAt(0))),
};
const pdf = [...'%PDF-1.4 not a photo'].map((c) => c.charCodeAt(0));

function asset(name: string, type: string, bytes: number[]): ImagePicker.ImagePickerAsset {
  const file = new File([new Uint8Array(bytes)], name, { type });
  return {
    uri: `blob:${name}`,
    width: 64,
    height: 48,
    type: type.startsWith('image/') ? 'image' : undefined,
    mimeType: type,
    fileName: name,
    file,
  } as ImagePicker.ImagePickerAsset;
}

describe('the photo picker takes photos only, and says so at once', () => {
  afterEach(() => library.mockReset());

  it('knows each photo format the server keeps by its first bytes, and a PDF for what it is', () => {
    for (const [kind, bytes] of Object.entries(signatures))
      expect([kind, isPhotoBytes(new Uint8Array(bytes))]).toEqual([kind, true]);
    expect(isPhotoBytes(new Uint8Array(pdf))).toBe(false);
    expect(isPhotoBytes(new Uint8Array([]))).toBe(false);
  });

  it('refuses a PDF at the picker, naming it and the kinds it takes, with nothing kept', async () => {
    library.mockResolvedValue({ canceled: false, assets: [asset('notes.pdf', 'application/pdf', pdf)] });
    const r = await pickPhotos('library', 6);
    expect(r.photos).toEqual([]);
    expect(r.error).toBe('"notes.pdf" is not a photo. Choose a JPEG, PNG, WebP or HEIC image.');
  });

  it('refuses a file that only claims to be a JPEG by its name and type', async () => {
    library.mockResolvedValue({ canceled: false, assets: [asset('hole.jpg', 'image/jpeg', pdf)] });
    const r = await pickPhotos('library', 6);
    expect(r.photos).toEqual([]);
    expect(r.error).toContain('"hole.jpg" is not a photo');
  });

  it('keeps the real photos of a mixed choice and names only the files it refused', async () => {
    library.mockResolvedValue({
      canceled: false,
      assets: [
        asset('a.jpg', 'image/jpeg', signatures.jpeg),
        asset('b.txt', 'text/plain', pdf),
        asset('c.png', 'image/png', signatures.png),
        asset('d.mp4', 'video/mp4', pdf),
      ],
    });
    const r = await pickPhotos('library', 6);
    expect(r.photos.map((p) => p.name)).toEqual(['a.jpg', 'c.png']);
    expect(r.error).toBe('"b.txt" and "d.mp4" are not photos. Choose JPEG, PNG, WebP or HEIC images.');
  });

  it("puts the web picker's own refusal of a non-image in the same plain words", async () => {
    library.mockRejectedValue(
      new Error('Unsupported file type: application/pdf. Only images and videos are supported.'),
    );
    const r = await pickPhotos('library', 6);
    expect(r).toEqual({ photos: [], error: notPhotosMessage([]) });
  });
});

const traveler: TravelerDetail = {
  ...standardTraveler,
  id: '0b7e9a52-5a1c-4b8e-9d0e-3f1f2a6c7d11',
  holesTotal: 2,
  holesDone: 1,
  lines: [upperFlangeOf(4)],
  holes: [holeU(1, 0.25, 'installed'), holeU(2, 1.25, 'pending')],
  readiness: { ready: false, reasons: [] },
};

describe('a photo the server refuses', () => {
  afterEach(() => window.localStorage.clear());

  it('is said once, under the photos; the line by the button only points there', async () => {
    window.localStorage.setItem(
      storageKeys.findingDraft(null, traveler.id),
      JSON.stringify({
        values: { holeIds: ['U-02'], kind: 'hole_elongated', note: 'oval', measurements: {} },
        photos: [{ uri: 'data:image/jpeg;base64,AAAA', name: 'hole.jpg', type: 'image/jpeg' }],
        savedAt: '2026-11-04T10:00:00.000Z',
      }),
    );
    // As server/photos/image-processing.ts answers: the field carries the message's own words.
    const said = '"hole.jpg" is not a photo: send a JPEG, PNG, WebP or HEIC image';
    recordFetch({
      '/api/findings': {
        status: 415,
        body: { error: { code: 'not_an_image', message: said, fields: { photos: said } } },
      },
    });
    const r = wrap(<FlagScreen travelerId={traveler.id} initialHoleIds={['U-02']} />, { traveler });
    await r.settle();
    await r.press('submit-finding');
    expect(r.byTestId('photos-error').textContent).toBe(`${said.charAt(0).toUpperCase()}${said.slice(1)}.`);
    expect(r.byTestId('finding-error').textContent).toContain('a photo was refused');
    // "is not a photo" appears once on the whole screen.
    expect(r.text().split('is not a photo').length - 1).toBe(1);
  });
});

describe("text in the app's own faces", () => {
  const fontOf = (el: Element) => (el as HTMLElement).style.fontFamily || getComputedStyle(el).fontFamily;

  it("draws a notice made of several pieces of words (the sign-off line) in the app's text face", () => {
    const by = 'Priya Ashdown';
    const r = renderWeb(
      <Notice tone="ok" testID="signed-off">
        Signed off{by ? ` by ${by}` : ''}
        {' on 2 Dec'}.
      </Notice>,
    );
    const notice = r.byTestId('signed-off');
    // Every text node sits inside an element in Atkinson Hyperlegible, none straight in the notice's box.
    const walker = document.createTreeWalker(notice, NodeFilter.SHOW_TEXT);
    let n = 0;
    for (let t = walker.nextNode(); t; t = walker.nextNode()) {
      n++;
      expect(t.parentElement).not.toBe(notice);
      expect(fontOf(t.parentElement!)).toContain(fonts.text);
    }
    expect(n).toBeGreaterThan(0);
    expect(notice.textContent).toBe('Signed off by Priya Ashdown on 2 Dec.');
  });

  it('keeps a notice of words with an inline value in one line of text, and leaves blocks as they are', () => {
    const r = renderWeb(
      <Notice testID="n">
        This part replaces serial <Mono bold>NK2-0147-W-104</Mono>, taken out.
      </Notice>,
    );
    const first = r.byTestId('n').firstElementChild!;
    expect(first.textContent).toBe('This part replaces serial NK2-0147-W-104, taken out.');
    expect(fontOf(first)).toContain(fonts.text);
    const blocks = renderWeb(
      <Notice testID="b">
        <Txt testID="b1">One.</Txt>
        <Txt testID="b2">Two.</Txt>
      </Notice>,
    );
    expect(blocks.byTestId('b1').parentElement).toBe(blocks.byTestId('b'));
  });

  it('lets an e-mail address wrap on a narrow row, while a short value stays whole', () => {
    const r = renderWeb(
      <>
        <Mono testID="mail">admin@pitchcard.example</Mono>
        <Mono testID="callout">MS20470AD4-4</Mono>
      </>,
    );
    expect(r.byTestId('mail').style.whiteSpace).not.toBe('nowrap');
    expect(r.byTestId('callout').style.whiteSpace).toBe('nowrap');
  });

  it('breaks a run of values between values only: never inside a hole id, nor a number from its unit', () => {
    expect(valueGroups('U-11 U-12 U-13')).toEqual(['U-11', 'U-12', 'U-13']);
    expect(valueGroups('0.016 in · MS20426AD3')).toEqual(['0.016 in ·', 'MS20426AD3']);
    expect(valueGroups('Dec 2, 2026, 12:46 PM')).toEqual(['Dec', '2,', '2026,', '12:46 PM']);
    const r = renderWeb(
      <>
        <Mono testID="holes">U-11 U-12 U-13 U-14 U-15 U-16</Mono>
        <Mono testID="pair">0.016 in · MS20426AD3</Mono>
      </>,
    );
    const spans = (id: string) => Array.from(r.byTestId(id).children as HTMLCollectionOf<HTMLElement>);
    // The run itself may wrap; each id inside it is kept whole.
    expect(r.byTestId('holes').style.whiteSpace).not.toBe('nowrap');
    expect(spans('holes').map((s) => [s.textContent, s.style.whiteSpace])).toEqual(
      ['U-11', 'U-12', 'U-13', 'U-14', 'U-15', 'U-16'].map((h) => [h, 'nowrap']),
    );
    expect(spans('pair').map((s) => s.textContent)).toEqual(['0.016 in ·', 'MS20426AD3']);
    expect(r.byTestId('pair').textContent).toBe('0.016 in · MS20426AD3');
  });
});

describe('places by role', () => {
  it("closes the shop's work to the admin and the supplier's pages to builders and inspectors", () => {
    const table: [Parameters<typeof mayOpen>[0], Parameters<typeof mayOpen>[1], boolean][] = [
      ['admin', 'people', true],
      ['admin', 'phone', true],
      ['admin', 'account', true],
      ['admin', 'index', true],
      ['admin', 'catalogue', false],
      ['admin', 'builds', false],
      ['admin', 'findings', false],
      ['admin', 'bench', false],
      ['admin', 'travelers', false],
      ['admin', 'studies', false],
      ['admin', 'coupons', false],
      ['builder', 'catalogue', false],
      ['inspector', 'studies', false],
      ['builder', 'builds', true],
      ['inspector', 'findings', true],
      ['supplier', 'catalogue', true],
      ['supplier', 'builds', true],
      ['supplier', 'people', true],
    ];
    for (const [role, route, open] of table) expect([role, route, mayOpen(role, route)]).toEqual([role, route, open]);
  });

  it("drops a link left by the last person when it leads to a page not of the new person's role", () => {
    expect(mayOpenPath('admin', '/catalogue/designs/abc?x=1')).toBe(false);
    expect(mayOpenPath('admin', '/(app)/builds')).toBe(false);
    expect(mayOpenPath('admin', '/people')).toBe(true);
    expect(mayOpenPath('builder', '/travelers/abc')).toBe(true);
    // Pages outside the tabs (a scanned label, an invitation) are no role's alone.
    expect(mayOpenPath('admin', '/t/XYZ')).toBe(true);
  });
});

describe('tab labels on a phone', () => {
  it("give a supplier's six tabs at 390 px a smaller size and room for a second line; four tabs keep 14 px", () => {
    expect(tabLabelFit(390, 6, false)).toMatchObject({ fontSize: 12, barMinHeight: 72, short: true });
    expect(tabLabelFit(390, 5, false)).toMatchObject({ fontSize: 12, short: false });
    expect(tabLabelFit(390, 4, false)).toMatchObject({ fontSize: 14, short: false });
    expect(tabLabelFit(1280, 6, true)).toMatchObject({ fontSize: 14 });
  });
});

describe('files picked and not sent yet', () => {
  const picked = [
    { uri: 'data:image/jpeg;base64,AAAA', name: 'left flange.jpg' },
    { uri: 'data:image/jpeg;base64,BBBB', name: 'right flange.jpg' },
  ];
  const tiles = (items: typeof picked, onRemove: (i: number) => void) =>
    renderWeb(
      <DraftTiles
        items={items}
        thumb={(p) => <Txt>{p.name}</Txt>}
        removeLabel={(p) => `Remove ${p.name}`}
        onRemove={onRemove}
        tileTestID={(i) => `tile-${i}`}
        removeTestID={(i) => `remove-${i}`}
        empty="Nothing picked yet."
      />,
    );

  it('shows each with a Remove button of its own, named for it, that takes back that one only', async () => {
    const onRemove = jest.fn();
    const r = tiles(picked, onRemove);
    expect(r.byTestId('tile-1').textContent).toContain('right flange.jpg');
    expect(r.byTestId('remove-1').getAttribute('aria-label')).toBe('Remove right flange.jpg');
    await r.press('remove-1');
    expect(onRemove.mock.calls).toEqual([[1]]);
  });

  it('says what to add when nothing is picked', () => {
    const r = tiles([], jest.fn());
    expect(r.queryByTestId('tile-0')).toBeNull();
    expect(r.text()).toBe('Nothing picked yet.');
  });
});

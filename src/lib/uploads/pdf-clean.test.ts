import { PDFDocument, PDFName, PDFString } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { cleanPdf } from './pdf-clean';

/** A one-page PDF carrying every kind of active content we strip. */
async function armedPdf(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const page = doc.addPage([300, 300]);
  const ctx = doc.context;
  const js = ctx.obj({ S: 'JavaScript', JS: PDFString.of('app.alert("lagwise-probe")') });
  doc.catalog.set(PDFName.of('OpenAction'), js);
  doc.catalog.set(PDFName.of('AA'), ctx.obj({ WC: js }));
  const embedded = ctx.register(ctx.obj({ Type: 'EmbeddedFile' }));
  doc.catalog.set(
    PDFName.of('Names'),
    ctx.obj({
      JavaScript: ctx.obj({ Names: [PDFString.of('probe'), js] }),
      EmbeddedFiles: ctx.obj({ Names: [PDFString.of('payload.exe'), ctx.obj({ Type: 'Filespec', EF: ctx.obj({ F: embedded }) })] }),
    }),
  );
  const launch = ctx.register(
    ctx.obj({ Type: 'Annot', Subtype: 'Link', Rect: [0, 0, 50, 50], A: ctx.obj({ S: 'Launch', F: PDFString.of('calc.exe') }) }),
  );
  const attachment = ctx.register(ctx.obj({ Type: 'Annot', Subtype: 'FileAttachment', Rect: [60, 0, 80, 20] }));
  const link = ctx.register(
    ctx.obj({ Type: 'Annot', Subtype: 'Link', Rect: [100, 0, 150, 50], A: ctx.obj({ S: 'URI', URI: PDFString.of('https://lagwise.example/') }) }),
  );
  page.node.set(PDFName.of('Annots'), ctx.obj([launch, attachment, link]));
  page.node.set(PDFName.of('AA'), ctx.obj({ O: js }));
  return doc.save({ useObjectStreams: false });
}

describe('cleanPdf', () => {
  it('keeps the pages and a plain link, and drops scripts, launch actions and embedded files', async () => {
    const armed = Buffer.from(await armedPdf());
    for (const marker of ['/JavaScript', '/OpenAction', '/Launch', '/EmbeddedFile', '/FileAttachment']) {
      expect(armed.includes(marker), `the test file carries ${marker}`).toBe(true);
    }
    const result = await cleanPdf(armed);
    if (!result.ok) throw new Error(`refused: ${result.reason}`);
    const cleaned = Buffer.from(result.bytes);
    for (const marker of ['/JavaScript', '/OpenAction', '/Launch', '/EmbeddedFile', '/FileAttachment', 'lagwise-probe', '/AA']) {
      expect(cleaned.includes(marker), `${marker} is gone`).toBe(false);
    }
    expect(cleaned.includes('/URI')).toBe(true);
    expect(result.pages).toBe(1);
    expect((await PDFDocument.load(cleaned)).getPageCount()).toBe(1);
  });

  it('refuses what is not a PDF it can read', async () => {
    expect(await cleanPdf(Buffer.from('%PDF-1.7\n garbage %%EOF'))).toMatchObject({ ok: false });
  });
});

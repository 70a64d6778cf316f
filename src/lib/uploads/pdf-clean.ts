/**
 * A PDF can carry more than pages: JavaScript run on opening (OpenAction, additional actions),
 * launch actions that start programs, embedded files, forms that submit elsewhere. We keep the
 * pages and nothing else: the pages are copied (with pdf-lib) into a new, empty document —
 * which leaves the catalog's actions, names tree (JavaScript, EmbeddedFiles) and forms behind —
 * and each page's annotations lose every action but a plain link.
 */
import { PDFArray, PDFDict, PDFDocument, PDFName, type PDFObject, type PDFPage } from 'pdf-lib';

/** Annotations that exist to carry or play a file; they go whole. */
const FILE_ANNOTATIONS = new Set(['/FileAttachment', '/Sound', '/Movie', '/Screen', '/RichMedia', '/3D']);
/** Actions a link may keep: go to a web address, or to a place in this document. */
const HARMLESS_ACTIONS = new Set(['/URI', '/GoTo']);

export type PdfCleanResult = { ok: true; bytes: Uint8Array; pages: number } | { ok: false; reason: 'encrypted' | 'unreadable' | 'empty' };

function cleanAnnotations(page: PDFPage): void {
  const node = page.node;
  node.delete(PDFName.of('AA'));
  const annots = node.lookupMaybe(PDFName.of('Annots'), PDFArray);
  if (!annots) return;
  const kept: PDFObject[] = [];
  for (let i = 0; i < annots.size(); i += 1) {
    const ref = annots.get(i);
    const annot = node.context.lookupMaybe(ref, PDFDict);
    if (!annot) continue;
    const subtype = annot.get(PDFName.of('Subtype'))?.toString() ?? '';
    if (FILE_ANNOTATIONS.has(subtype)) continue;
    annot.delete(PDFName.of('AA'));
    const action = annot.lookupMaybe(PDFName.of('A'), PDFDict);
    const kind = action?.get(PDFName.of('S'))?.toString() ?? '';
    if (action && !HARMLESS_ACTIONS.has(kind)) annot.delete(PDFName.of('A'));
    if (action && kind === '/GoTo') action.delete(PDFName.of('Next'));
    if (action && kind === '/URI') action.delete(PDFName.of('Next'));
    kept.push(ref);
  }
  node.set(PDFName.of('Annots'), node.context.obj(kept));
}

/** Copies the pages of `source` into a new document (which brings only what the pages reach). */
async function copyPagesOf(source: PDFDocument, clean: (page: PDFPage) => void): Promise<PDFDocument> {
  const target = await PDFDocument.create({ updateMetadata: false });
  const pages = await target.copyPages(source, source.getPageIndices());
  for (const page of pages) {
    clean(page);
    target.addPage(page);
  }
  return target;
}

/** The PDF's pages in a new document without active content, or why it cannot be done. */
export async function cleanPdf(bytes: Uint8Array): Promise<PdfCleanResult> {
  let source: PDFDocument;
  try {
    source = await PDFDocument.load(bytes, { updateMetadata: false });
  } catch (error) {
    return { ok: false, reason: (error as Error).name === 'EncryptedPDFError' ? 'encrypted' : 'unreadable' };
  }
  try {
    if (source.getPageCount() === 0) return { ok: false, reason: 'empty' };
    // First pass strips; the second copies again, so objects the first pass cut loose (a removed
    // attachment, an action) are not carried along unreferenced.
    const stripped = await copyPagesOf(source, cleanAnnotations);
    const clean = await copyPagesOf(stripped, () => {});
    return { ok: true, bytes: await clean.save({ useObjectStreams: false }), pages: clean.getPageCount() };
  } catch {
    return { ok: false, reason: 'unreadable' };
  }
}

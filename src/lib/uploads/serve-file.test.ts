import { describe, expect, it } from 'vitest';
import { storedFileResponse } from './serve-file';

describe('storedFileResponse', () => {
  it('hands a PDF out as a sandboxed download, never inline', () => {
    const response = storedFileResponse(Buffer.from('%PDF-1.7'), 'application/pdf', 'Łódź steam survey.pdf');
    expect(response.headers.get('content-type')).toBe('application/pdf');
    expect(response.headers.get('content-disposition')).toMatch(/^attachment; filename="_?[^"]*survey.pdf"; filename\*=UTF-8''/);
    expect(response.headers.get('content-security-policy')).toMatch(/^sandbox;/);
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
    expect(response.headers.get('cache-control')).toBe('private, no-store');
  });

  it('shows our re-encoded photos inline, still sandboxed, and anything else as bytes to download', () => {
    expect(storedFileResponse(Buffer.from([1]), 'image/jpeg', 'valve.jpg').headers.get('content-disposition')).toMatch(/^inline;/);
    const other = storedFileResponse(Buffer.from('<svg/>'), 'image/svg+xml', 'x.svg');
    expect(other.headers.get('content-type')).toBe('application/octet-stream');
    expect(other.headers.get('content-disposition')).toMatch(/^attachment;/);
  });
});

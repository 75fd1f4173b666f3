import { describe, expect, it } from 'vitest';
import {
  inspectPhoto,
  inspectPhotoStream,
  MAX_PHOTO_BYTES,
} from '@/features/runner/server/photo-check';

// The first bytes of real files: JPEG (JFIF) and PNG signatures per their specifications.
const JPEG_HEAD = [0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01];
const PNG_HEAD = [
  0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0x00, 0x00, 0x00, 0x0d, 0x49, 0x48, 0x44, 0x52,
];
const withHead = (head: number[], size = 4096) => {
  const b = new Uint8Array(size);
  b.set(head);
  return b;
};

describe('inspectPhoto: judged by the bytes, not the name or declared type', () => {
  it('accepts JPEG and PNG content', async () => {
    expect(await inspectPhoto(withHead(JPEG_HEAD))).toEqual({ ok: true, mime: 'image/jpeg' });
    expect(await inspectPhoto(withHead(PNG_HEAD))).toEqual({ ok: true, mime: 'image/png' });
  });
  it('refuses a text file renamed bead.jpg', async () => {
    expect(await inspectPhoto(new TextEncoder().encode('these are my notes, not a photo'))).toEqual(
      { ok: false, message: 'That file is not a JPEG, PNG or WebP photo.' },
    );
  });
  it('refuses a PDF', async () => {
    expect(await inspectPhoto(new TextEncoder().encode('%PDF-1.7\n%âãÏÓ\n1 0 obj'))).toMatchObject({
      ok: false,
    });
  });
  it('refuses an image over 10 MB', async () => {
    expect(await inspectPhoto(withHead(JPEG_HEAD, MAX_PHOTO_BYTES + 1))).toEqual({
      ok: false,
      message: 'The photo is 10.0 MB; at most 10 MB.',
    });
  });
});

describe('inspectPhotoStream: the upload callback reads the file as a stream with a limit', () => {
  const chunks = (first: Uint8Array, count: number, size = 1024 * 1024) => {
    let pulled = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (pulled === count) return controller.close();
        controller.enqueue(pulled === 0 ? first : new Uint8Array(size));
        pulled++;
      },
    });
    return { stream, pulled: () => pulled };
  };
  it('judges a photo by its first bytes and counts the rest', async () => {
    const { stream } = chunks(withHead(JPEG_HEAD, 1024 * 1024), 3);
    expect(await inspectPhotoStream(stream)).toEqual({
      ok: true,
      mime: 'image/jpeg',
      bytes: 3 * 1024 * 1024,
    });
  });
  it('stops reading a file past 10 MB instead of holding it all', async () => {
    const { stream, pulled } = chunks(withHead(JPEG_HEAD, 1024 * 1024), 500);
    expect(await inspectPhotoStream(stream)).toEqual({
      ok: false,
      message: 'The photo is over 10 MB; at most 10 MB.',
    });
    expect(pulled()).toBeLessThan(15);
  });
});

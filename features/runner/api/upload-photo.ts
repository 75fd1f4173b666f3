'use client';

import { generateUploadButton } from '@uploadthing/react';
import type { PhotoRouter } from '../server/photo-router';

/** The upload SDK's own button, bound to our photo route (its route handler is /api/uploadthing). */
export const UploadButton = generateUploadButton<PhotoRouter>();

/**
 * The button's class merger: it is called with the component's default classes first and ours
 * (from `appearance`) last. Keeping only ours lets the shop theme replace the stock look whole,
 * instead of two sets of sizes and colours fighting over one element.
 */
export const oursOnly = (...classes: (string | false | null | undefined)[]) =>
  (classes.at(-1) || '') as string;

/**
 * Shrinks a photo on the phone before it travels over the shop Wi-Fi: long edge about 2000 px,
 * JPEG. A file the browser cannot decode is sent as it is, and the server judges its bytes.
 */
export async function downscale(file: File, longEdge = 2000): Promise<File> {
  try {
    const bitmap = await createImageBitmap(file);
    const scale = Math.min(1, longEdge / Math.max(bitmap.width, bitmap.height));
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(bitmap.width * scale);
    canvas.height = Math.round(bitmap.height * scale);
    canvas.getContext('2d')!.drawImage(bitmap, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) =>
      canvas.toBlob(resolve, 'image/jpeg', 0.85),
    );
    if (!blob) return file;
    return new File([blob], file.name.replace(/\.[^.]+$/, '') + '.jpg', {
      type: 'image/jpeg',
      lastModified: file.lastModified,
    });
  } catch {
    return file;
  }
}

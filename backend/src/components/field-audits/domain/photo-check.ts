import type { PhotoType } from '@shared/field-audits/field-audit-dto';

/**
 * The image type the bytes really are, from their signature (JPEG FF D8 FF, PNG's 8-byte signature, WebP's
 * RIFF….WEBP); null for anything else, whatever the Content-Type header said.
 */
export function sniffImageType(bytes: Buffer): PhotoType | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'image/jpeg';
  if (bytes.length >= 8 && bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])))
    return 'image/png';
  if (bytes.length >= 12 && bytes.toString('latin1', 0, 4) === 'RIFF' && bytes.toString('latin1', 8, 12) === 'WEBP')
    return 'image/webp';
  return null;
}

export function photoExtension(type: PhotoType): string {
  return type === 'image/jpeg' ? 'jpg' : type === 'image/png' ? 'png' : 'webp';
}

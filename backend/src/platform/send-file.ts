import type { Response } from 'express';

/** Sends an export as a download that no cache keeps. */
export function sendFile(res: Response, body: string | Buffer, type: string, filename: string): void {
  res.setHeader('Content-Type', type);
  res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(body);
}

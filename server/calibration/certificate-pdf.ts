import PDFDocument from 'pdfkit';
import type { Certification } from '../../shared/api/calibration-answers.js';
import { serverDay } from '../core/day-words.js';

/**
 * A one-page A4 certificate: observer, session, date, the rules and the figures that met them, and
 * until when it holds. The PDF's built-in Helvetica has no Greek letters, so κ and ΔE00 are
 * spelt "kappa" and "dE00" here.
 */
export function certificatePdf(cert: Certification): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 56,
    // One small page: left uncompressed so its words can be searched and checked as text.
    compress: false,
    info: { Title: `Hueledger calibration certificate ${cert.id}`, Author: 'Hueledger', Subject: `Observer calibration: ${cert.name}` },
  });
  const parts: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => parts.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(parts)));
    doc.on('error', reject);
  });
  const line = (label: string, value: string) => {
    doc.font('Helvetica-Bold').fontSize(11).text(`${label}: `, { continued: true }).font('Helvetica').text(value);
    doc.moveDown(0.3);
  };
  doc.font('Helvetica-Bold').fontSize(20).text('Certificate of colour calibration');
  doc.moveDown(0.5);
  doc.font('Helvetica').fontSize(12).text(`${cert.name} is certified to read taro colours against reference set ${cert.referenceSetId}.`);
  doc.moveDown();
  line('Observer', cert.name);
  line('Session', `"${cert.sessionTitle}" (session ${cert.sessionId})`);
  line('Certified on', serverDay(cert.certifiedOn));
  line('Valid until', `${serverDay(cert.validUntil)}, unless a later session does not certify the observer`);
  line('Status today', cert.status === 'current' ? 'current' : `lapsed on ${serverDay(cert.lapsedOn ?? '')}: ${cert.lapseReason}`);
  doc.moveDown(0.5);
  doc.font('Helvetica-Bold').fontSize(13).text('Rules and figures');
  doc.moveDown(0.3);
  line('Group agreement (Fleiss\' kappa over field chips)', `${cert.kappa.toFixed(2)}, rule at least ${cert.thresholds.kappa}`);
  line('Observer\'s mean CIEDE2000 difference (dE00) from the references', `${cert.meanDeltaE00.toFixed(2)}, limit ${cert.thresholds.deltaE00}`);
  line('Specimens answered', `${cert.n}, every specimen of the session`);
  line('Colour-vision screening (self-reported)', cert.screening ? `${cert.screening.result}, ${serverDay(cert.screening.screenedOn)}` : 'not recorded');
  doc.moveDown();
  doc.font('Helvetica').fontSize(9).fillColor('#444444').text(
    `Certificate ${cert.id}, issued by Hueledger. Colours on screens and in print are approximate; the certificate covers judging colour under the session's viewing conditions only.`,
  );
  doc.end();
  return done;
}

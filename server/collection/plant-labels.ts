/*
 * Plant labels: a printable A4 sheet of labels, each with the accession number, the plant label,
 * the site and a QR code holding the plant sheet's address, so a phone's camera (or the app's
 * "Scan a label") opens the sheet of that plant. The QR is drawn as vector squares from the
 * `qrcode` package's module matrix (ISO/IEC 18004), error correction level M, with the four-module
 * quiet zone the standard asks for. Label size 63.5 × 38.1 mm in 3 × 7 is a common sheet layout
 * (common practice, no source); print on weatherproof (polyester) label stock for the field.
 */
import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import type { DataSource } from 'typeorm';
import { AppError } from '../core/app-error.js';
import { Plant } from './accession.entity.js';

const MM = 72 / 25.4;
const LABEL = { width: 63.5 * MM, height: 38.1 * MM, columns: 3, rows: 7 };
const PAGE = { width: 210 * MM, height: 297 * MM };
/** Left and top margins that centre the grid on A4. */
const LEFT = (PAGE.width - LABEL.columns * LABEL.width) / 2;
const TOP = (PAGE.height - LABEL.rows * LABEL.height) / 2;
/** The quiet zone around a QR symbol, in modules (ISO/IEC 18004: four modules). */
const QUIET = 4;

/** One plant as its label shows it. */
export interface LabelPlant {
  id: number;
  accessionNumber: string;
  accessionName: string;
  plantLabel: string;
  siteCode: string;
}

/** Which plants to label: those of one accession, or all plants at one site. */
export type LabelQuery = { accessionId: number } | { siteId: number };

/** The plants to label, by accession number then plant label; 404 when there are none. */
export async function labelPlants(ds: DataSource, q: LabelQuery): Promise<LabelPlant[]> {
  const where = 'accessionId' in q ? { accession: { id: q.accessionId } } : { site: { id: q.siteId } };
  const plants = await ds.getRepository(Plant).find({ where, relations: { accession: true, site: true } });
  if (!plants.length) throw AppError.notFound('accessionId' in q ? `Accession ${q.accessionId} has no plants to label.` : `Site ${q.siteId} has no plants to label.`);
  const byNumber = (a: LabelPlant, b: LabelPlant) => a.accessionNumber.localeCompare(b.accessionNumber, 'en', { numeric: true }) || a.plantLabel.localeCompare(b.plantLabel, 'en', { numeric: true });
  return plants.map((p) => ({ id: p.id, accessionNumber: p.accession.accessionNumber, accessionName: p.accession.name, plantLabel: p.label, siteCode: p.site.code })).sort(byNumber);
}

/** The address a plant's label carries: its sheet in the app. */
export function plantSheetUrl(publicUrl: string, plantId: number): string {
  return `${publicUrl.replace(/\/+$/, '')}/record/plant/${plantId}`;
}

function drawQr(doc: PDFKit.PDFDocument, text: string, x: number, y: number, size: number): void {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const n = qr.modules.size;
  const cell = size / (n + 2 * QUIET);
  doc.save().rect(x, y, size, size).fill('#ffffff');
  doc.fillColor('#000000');
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      if (qr.modules.get(r, c)) doc.rect(x + (c + QUIET) * cell, y + (r + QUIET) * cell, cell, cell);
    }
  }
  doc.fill().restore();
}

function drawLabel(doc: PDFKit.PDFDocument, plant: LabelPlant, url: string, x: number, y: number): void {
  const pad = 2.5 * MM;
  const qrSize = LABEL.height - 2 * pad;
  doc.save().lineWidth(0.3).strokeColor('#bbbbbb').roundedRect(x + 1, y + 1, LABEL.width - 2, LABEL.height - 2, 6).stroke().restore();
  drawQr(doc, url, x + pad, y + pad, qrSize);
  const textX = x + pad + qrSize + 2 * MM;
  const width = LABEL.width - (textX - x) - pad;
  doc.fillColor('#000000').font('Helvetica-Bold').fontSize(13).text(plant.accessionNumber, textX, y + pad + 1 * MM, { width, lineBreak: false, ellipsis: true });
  doc.font('Helvetica').fontSize(9).text(plant.accessionName, textX, doc.y + 1, { width, height: 11, ellipsis: true });
  doc.font('Helvetica-Bold').fontSize(16).text(`Plant ${plant.plantLabel}`, textX, y + 17 * MM, { width, lineBreak: false, ellipsis: true });
  doc.font('Helvetica').fontSize(9).text(`Site ${plant.siteCode}`, textX, doc.y + 1, { width, lineBreak: false, ellipsis: true });
}

/** Renders the label sheet(s): 21 labels a page, left to right, top to bottom. */
export function renderPlantLabels(plants: readonly LabelPlant[], publicUrl: string): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 0, autoFirstPage: false, info: { Title: 'Hueledger plant labels', Author: 'Hueledger', Subject: 'Plant labels with the QR address of each plant sheet' } });
  const parts: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => parts.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(parts)));
    doc.on('error', reject);
  });
  const perPage = LABEL.columns * LABEL.rows;
  plants.forEach((plant, i) => {
    if (i % perPage === 0) doc.addPage();
    const slot = i % perPage;
    const x = LEFT + (slot % LABEL.columns) * LABEL.width;
    const y = TOP + Math.floor(slot / LABEL.columns) * LABEL.height;
    drawLabel(doc, plant, plantSheetUrl(publicUrl, plant.id), x, y);
  });
  doc.end();
  return done;
}

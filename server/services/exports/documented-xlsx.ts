/**
 * Writes documented tables into an exceljs workbook: bold frozen header, a number format per
 * column (from its ColumnFormat and, for money, the cost unit) and widths that fit the content,
 * then one "Codebook" sheet for all of them. Text goes in as text cells, which spreadsheet
 * programs never evaluate as formulas.
 */
import ExcelJS from 'exceljs';
import { getCurrencyCode } from '../../../shared/format';
import {
  buildCodebookRows,
  codebookHeader,
  type ColumnFormat,
  type DocumentedTable,
} from './documented-table';

export const CODEBOOK_SHEET = 'Codebook';

/** A results workbook made at `at`, with its "About" sheet of `facts` as sheet 1. */
export function createResultsWorkbook(
  at: Date,
  facts: readonly (readonly [string, string | number])[],
): ExcelJS.Workbook {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Choicewright';
  workbook.created = at;
  addAboutSheet(workbook, facts);
  return workbook;
}

/** Sheet 1 of every results workbook: what the file is about, one fact a row. */
export function addAboutSheet(
  workbook: ExcelJS.Workbook,
  facts: readonly (readonly [string, string | number])[],
): ExcelJS.Worksheet {
  const about = workbook.addWorksheet('About');
  about.columns = [
    { header: 'About this file', key: 'item', width: 48 },
    { header: '', key: 'value', width: 110 },
  ];
  about.getRow(1).font = { bold: true };
  for (const [item, value] of facts) about.addRow({ item, value });
  about.getColumn('value').alignment = { wrapText: true, vertical: 'top' };
  return about;
}

/** An Excel number format for money in this unit: symbol before, other units after. */
export function moneyFormat(unit: string): string {
  const u = unit.trim().replace(/"/g, '');
  const body = '#,##0.00';
  if (!u) return body;
  if (getCurrencyCode(u) && u.length < 3) return `"${u}"${body};-"${u}"${body}`;
  return `${body}" ${u}"`;
}

export function numberFormat(format: ColumnFormat, moneyUnit: string): string | undefined {
  switch (format) {
    case 'integer':
      return '#,##0';
    case 'estimate':
      return '0.0000';
    case 'p':
    case 'ratio':
      return '0.000';
    case 'seconds':
      return '0.0';
    case 'money':
      return moneyFormat(moneyUnit);
    default:
      return undefined;
  }
}

const widthOf = (v: unknown) =>
  v === null || v === undefined ? 0 : typeof v === 'number' ? 12 : String(v).length + 2;

/** Adds one sheet holding the table; returns it so callers can add notes below. */
export function addTableSheet(
  workbook: ExcelJS.Workbook,
  title: string,
  table: DocumentedTable,
  moneyUnit: string,
): ExcelJS.Worksheet {
  const sheet = workbook.addWorksheet(title, { views: [{ state: 'frozen', ySplit: 1 }] });
  sheet.addRow(table.columns.map((c) => c.key)).font = { bold: true };
  for (const row of table.rows) sheet.addRow(row.map((v) => (v === undefined ? null : v)));
  table.columns.forEach((c, i) => {
    const column = sheet.getColumn(i + 1);
    const fmt = numberFormat(c.format, moneyUnit);
    if (fmt)
      column.eachCell((cell, rowNumber) => {
        if (rowNumber > 1 && typeof cell.value === 'number') cell.numFmt = fmt;
      });
    const widest = Math.max(c.key.length + 2, ...table.rows.map((r) => widthOf(r[i])));
    column.width = Math.min(60, Math.max(8, widest));
  });
  return sheet;
}

/** The codebook sheet: every column of every table with meaning, unit and coding. */
export function addCodebookSheet(workbook: ExcelJS.Workbook, tables: readonly DocumentedTable[]) {
  const sheet = workbook.addWorksheet(CODEBOOK_SHEET, { views: [{ state: 'frozen', ySplit: 1 }] });
  sheet.addRow(codebookHeader).font = { bold: true };
  for (const row of buildCodebookRows(tables)) sheet.addRow(row);
  [12, 20, 70, 40, 40].forEach((w, i) => (sheet.getColumn(i + 1).width = w));
  sheet.getColumn(3).alignment = { wrapText: true, vertical: 'top' };
  return sheet;
}

/** Fetches an XLSX download through supertest and opens it with exceljs. */
import ExcelJS from 'exceljs';
import type supertest from 'supertest';

/** Reads a binary response body into a Buffer (supertest buffers only text by default). */
const binary = (res: NodeJS.ReadableStream, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

export async function downloadXlsx(
  agent: supertest.Agent,
  url: string,
  query: Record<string, string>,
): Promise<{ res: supertest.Response; workbook: ExcelJS.Workbook }> {
  const res = await agent
    .get(url)
    .query(query)
    .buffer(true)
    .parse(binary as never)
    .expect(200);
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(res.body as Parameters<typeof workbook.xlsx.load>[0]);
  return { res, workbook };
}

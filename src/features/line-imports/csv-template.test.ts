import { describe, expect, it } from 'vitest';
import { ISOLATION_POINT_CSV_COLUMNS, LINE_CSV_COLUMNS } from '@shared/schemas/line-imports';
import { TEMPLATE_COLUMNS, templateHref } from './csv-template';

describe('the import page’s templates', () => {
  it('name the same columns, in the same order, as the importer and the export', () => {
    expect(TEMPLATE_COLUMNS.lines.map((c) => c.name)).toEqual([...LINE_CSV_COLUMNS]);
    expect(TEMPLATE_COLUMNS['isolation-points'].map((c) => c.name)).toEqual([...ISOLATION_POINT_CSV_COLUMNS]);
  });

  it('download as a header-only CSV', () => {
    expect(decodeURIComponent(templateHref('lines').split(',').slice(1).join(','))).toBe(`${LINE_CSV_COLUMNS.join(',')}\r\n`);
  });
});

import { describe, expect, it } from 'vitest';
import { ISOLATION_POINT_CSV_COLUMNS, LINE_CSV_COLUMNS } from '@shared/schemas/register-columns';
import { templateHeader, templateHref } from './csv-template';

describe('the import page’s templates', () => {
  it('name the same columns, in the same order, as the importer and the export', () => {
    expect(templateHeader('lines').split(',')).toEqual([...LINE_CSV_COLUMNS]);
    expect(templateHeader('isolation-points').split(',')).toEqual([...ISOLATION_POINT_CSV_COLUMNS]);
  });

  it('are the documented register files, column for column', () => {
    expect(templateHeader('lines')).toBe('line_number,area,service,material,schedule,nominal_size,design_pressure_psi,design_temperature_f,drawing,notes');
    expect(templateHeader('isolation-points')).toBe('tag,line_number,kind,normal_position,notes');
  });

  it('download as a header-only CSV', () => {
    expect(decodeURIComponent(templateHref('lines').split(',').slice(1).join(','))).toBe(`${LINE_CSV_COLUMNS.join(',')}\r\n`);
  });
});

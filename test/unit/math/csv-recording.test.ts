import { expect } from 'chai';
import { recordingFromCsv } from '../../../shared/math/csv-recording.js';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import type { ColumnMapping } from '../../../shared/schemas/sweep-description.js';

const mapping: ColumnMapping = { time: 't', x: 'pos', forces: { x: 'f' } };

function refusal(text: string, map: Record<string, unknown> = mapping): string {
  try {
    recordingFromCsv(text, 'run.csv', 'train', ['x'], map as ColumnMapping);
  } catch (error) {
    expect(error).to.be.instanceOf(DiscoveryInputError);
    return (error as Error).message;
  }
  throw new Error('accepted');
}

describe('CSV recordings', () => {
  it('reads time, positions and forces by the column mapping, with quotes, CRLF, a BOM and blank lines', () => {
    const text = '\uFEFF"t", pos ,f,label\r\n0,1.5,0.1,a\r\n\r\n0.01,1.25e0,-2E-1,b\r\n0.02,.5,+3,c\r\n';
    const recording = recordingFromCsv(text, 'run.csv', 'validate', ['x'], mapping);
    expect(Array.from(recording.time)).to.deep.equal([0, 0.01, 0.02]);
    expect(Array.from(recording.positions[0]!)).to.deep.equal([1.5, 1.25, 0.5]);
    expect(Array.from(recording.forces![0]!)).to.deep.equal([0.1, -0.2, 3]);
    expect(recording.velocities).to.deep.equal([null]);
    expect(recording.role).to.equal('validate');
  });

  it('treats a recording without force columns as passive', () => {
    const recording = recordingFromCsv('t,pos\n0,1\n1,2\n', 'run.csv', 'train', ['x'], { time: 't', x: 'pos' });
    expect(recording.forces).to.equal(null);
  });

  it('names the file and the missing column, listing the columns it has', () => {
    expect(refusal('t,position,f\n0,1,0\n')).to.equal('run.csv has no column "pos" (its columns: "t", "position", "f").');
  });

  it('names the line, data row and column of a non-numeric or empty cell', () => {
    expect(refusal('t,pos,f\n0,1,0\n0.1,abc,0\n')).to.equal('run.csv, line 3 (data row 2), column "pos": "abc" is not a number.');
    expect(refusal('t,pos,f\n0,1,0\n0.1,2,\n')).to.contain('line 3 (data row 2), column "f": the cell is empty');
    expect(refusal('t,pos,f\n0,0x1A,0\n')).to.contain('"0x1A" is not a number');
    expect(refusal('t,pos,f\n0,Infinity,0\n')).to.contain('"Infinity" is not a number');
  });

  it('names the row where time stops increasing', () => {
    expect(refusal('t,pos,f\n0,1,0\n0.1,1,0\n0.1,1,0\n')).to.contain('line 4 (data row 3), column "t": time 0.1 does not increase');
    expect(refusal('t,pos,f\n0,1,0\n-0.1,1,0\n')).to.contain('data row 2');
  });

  it('refuses rows with the wrong number of cells and files without samples', () => {
    expect(refusal('t,pos,f\n0,1\n')).to.contain('line 2: 2 cells, but the header row has 3 columns');
    expect(refusal('t,pos,f\n')).to.contain('no samples');
    expect(refusal('')).to.contain('empty');
  });
});

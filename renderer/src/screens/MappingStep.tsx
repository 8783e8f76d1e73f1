/**
 * The mapping step: the importer was unsure of some columns (an inferred unit, an unknown
 * header). Shows the first rows as written, the importer's reading of each column, and lets
 * the user assign a variable and unit per column. The answer is saved as the importer's
 * column map (format `twofold-column-map`) for this export layout, so the next file from
 * the same cart imports without asking.
 */
import { useState } from 'react';
import { MAPPING_FORMAT, MAPPING_VERSION, serializeMapping, type ColumnMapping } from '../../../core/import/mapping';
import type { ColumnVariable } from '../../../core/import/types';
import type { MappingQuestion } from '../engine/protocol';
import { placeOf } from '../ui/notices';

export function MappingStep({ question, onAnswer }: { question: MappingQuestion; onAnswer: (layoutKey: string, mappingJson: string) => Promise<void> }) {
  const [choice, setChoice] = useState(question.columns.map((c) => ({ variable: c.variable ?? '', unit: c.unit ?? '' })));
  const unitsOf = (variable: string) => question.choices.find((c) => c.variable === variable)?.units ?? [];

  const answer = () => {
    const mapping: ColumnMapping = {
      format: MAPPING_FORMAT,
      version: MAPPING_VERSION,
      delimiter: null,
      decimal: null,
      headerLine: null,
      columns: question.headers.map((header, i) => ({
        header,
        variable: choice[i].variable === '' ? null : (choice[i].variable as ColumnVariable),
        unit: choice[i].variable === '' || choice[i].unit === '' ? null : choice[i].unit,
      })),
    };
    void onAnswer(question.layoutKey, serializeMapping(mapping));
  };

  return (
    <section className="panel mapping" data-testid="mapping-step">
      <h2>
        Check the columns of day {question.day}: {question.fileName}
      </h2>
      <ul className="warnings">
        {question.warnings.map((w, i) => (
          <li key={i}>
            <span className="error-place">{placeOf(w)}:</span> {w.message}
          </li>
        ))}
      </ul>
      <div className="scroll-x">
        <table className="mapping-table">
          <thead>
            <tr>
              {question.headers.map((h, i) => (
                <th key={i} scope="col">
                  <div className="header-cell">{h || `(column ${i + 1})`}</div>
                  <select aria-label={`Variable of column ${i + 1}`} value={choice[i].variable} onChange={(e) => setChoice((c) => c.map((x, j) => (j === i ? { variable: e.target.value, unit: unitsOf(e.target.value)[0] ?? '' } : x)))}>
                    <option value="">ignore</option>
                    {question.choices.map((c) => (
                      <option key={c.variable} value={c.variable}>
                        {c.label}
                      </option>
                    ))}
                  </select>
                  <select aria-label={`Unit of column ${i + 1}`} value={choice[i].unit} disabled={unitsOf(choice[i].variable).length === 0} onChange={(e) => setChoice((c) => c.map((x, j) => (j === i ? { ...x, unit: e.target.value } : x)))}>
                    <option value="">detect</option>
                    {unitsOf(choice[i].variable).map((u) => (
                      <option key={u} value={u}>
                        {u}
                      </option>
                    ))}
                  </select>
                  {question.columns[i].unitInferred && <div className="flag">unit was inferred</div>}
                  {question.columns[i].note && <div className="note">{question.columns[i].note}</div>}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {question.rows.map((row, r) => (
              <tr key={r}>
                {question.headers.map((_, i) => (
                  <td key={i}>{row[i] ?? ''}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <button type="button" className="primary" onClick={answer}>
        Use these columns and remember them for this layout
      </button>
    </section>
  );
}

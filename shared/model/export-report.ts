import type { FitResiduals, ModelDetails, RecordingCheck } from '../schemas/model-details.js';
import type { MassMatrixCheck } from '../schemas/model-validation.js';
import { escapeMarkup as esc, lineChartSvg } from './svg-line-chart.js';

/*
 * A printable, self-contained HTML page about one model: inline styles, inline SVG plots, no scripts and no
 * external resources, so it prints and archives as it is.
 */

const styles = `
  @page { size: A4; margin: 16mm; }
  body { font-family: system-ui, -apple-system, "Segoe UI", Roboto, sans-serif; color: #1b1b1b; margin: 24px auto; max-width: 720px; font-size: 13px; line-height: 1.45; }
  h1 { font-size: 20px; margin: 0 0 4px; }
  h2 { font-size: 15px; margin: 22px 0 6px; border-bottom: 1px solid #ccc; padding-bottom: 2px; }
  h3 { font-size: 13px; margin: 14px 0 4px; }
  .caution { border: 2px solid #b4572e; background: #fff4ee; padding: 8px 12px; font-weight: 600; }
  pre { white-space: pre-wrap; word-break: break-word; background: #f6f6f6; padding: 6px 8px; font-size: 12px; margin: 4px 0; }
  table { border-collapse: collapse; margin: 4px 0; }
  th, td { border: 1px solid #ccc; padding: 2px 6px; text-align: left; font-size: 12px; }
  td.number { text-align: right; font-variant-numeric: tabular-nums; }
  .muted { color: #555; }
  figure { margin: 8px 0; break-inside: avoid; }
  ul.warnings li { color: #8a3b12; }
`;

function number(value: number | null, digits = 4): string {
  if (value === null) return '–';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  return magnitude >= 1e5 || magnitude < 1e-3 ? value.toExponential(digits - 1) : String(Number(value.toPrecision(digits)));
}

function coefficientTable(details: ModelDetails): string {
  const { energy, lagrangian } = details.document;
  const terms = [...new Set([...energy.terms.map((t) => t.term), ...lagrangian.terms.map((t) => t.term)])];
  const rows = terms.map((term) => {
    const e = energy.terms.find((t) => t.term === term)?.coefficient ?? null;
    const l = lagrangian.terms.find((t) => t.term === term);
    const lagrangianCell = l === undefined ? '–' : l.coefficient === null ? 'not identifiable' : String(l.coefficient);
    return `<tr><td><code>${esc(term)}</code></td><td class="number">${e === null ? '–' : String(e)}</td><td class="number">${esc(lagrangianCell)}</td></tr>`;
  });
  return `<table><thead><tr><th>term</th><th>energy coefficient</th><th>Lagrangian coefficient</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

function equationsBlock(details: ModelDetails): string {
  const { document, latex } = details;
  const rows = document.coordinates.map((c, i) => {
    const left = document.equations.massMatrix[i]!
      .map((entry, k) => (entry === '0' ? null : `(${entry})*dd${document.coordinates[k]}`))
      .filter((part) => part !== null)
      .join(' + ');
    return `${left || '0'} = ${document.equations.forceVector[i]}   [${c}]`;
  });
  return `<p>M(q, dq) ddq = f(q, dq, u) from Euler-Lagrange; u_&lt;name&gt; is the generalized force on a coordinate.</p>
<pre>${esc(rows.join('\n'))}</pre>
<h3>LaTeX source</h3>
<pre>${esc([latex.energy, latex.lagrangian, ...latex.equations].join('\n\n'))}</pre>`;
}

function validationTable(checks: readonly RecordingCheck[]): string {
  if (checks.length === 0) return '<p class="muted">No recording was simulated.</p>';
  const rows = checks.map(({ figures: f }) => {
    const errors = f.errors.map((e) => `${esc(e.coordinate)}: ${number(e.rms)} / ${number(e.max)}`).join('<br>');
    const drift = f.energyDrift ? `${number(f.energyDrift.relative, 3)} of ${number(f.energyDrift.scale, 3)}` : '–';
    return `<tr><td>${esc(f.recording)} (${f.role})</td><td>${esc(f.status)}</td><td class="number">${number(f.start)}–${number(f.end)}</td><td>${errors}</td><td class="number">${f.timeToThreshold === null ? 'never' : `${number(f.timeToThreshold)} s`}</td><td class="number">${drift}</td></tr>`;
  });
  return `<table><thead><tr><th>recording</th><th>simulation</th><th>time span</th><th>error rms / max</th><th>error above ${number(checks[0]!.figures.threshold)} after</th><th>energy drift (relative)</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

function massMatrixTable(checks: readonly MassMatrixCheck[]): string {
  const rows = checks.map((c) => {
    const where = c.intervals.length === 0 ? 'everywhere positive definite' : c.intervals.map((i) => `${number(i.from)}–${number(i.to)}`).join(', ');
    return `<tr><td>${esc(c.recording)}</td><td class="number">${c.checkedStates}</td><td class="number">${c.notPositiveDefinite}</td><td>${esc(where)}</td></tr>`;
  });
  return `<table><thead><tr><th>recording</th><th>states</th><th>not positive definite</th><th>where (time)</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

function plots(check: RecordingCheck, coordinates: readonly string[]): string {
  const { trajectory, figures } = check;
  const charts = coordinates.map((c) =>
    lineChartSvg({
      title: `${figures.recording}: ${c}, simulated and recorded`,
      xLabel: 'time',
      yLabel: c,
      series: [
        { name: 'recorded', x: trajectory.time, y: trajectory.recorded[c] ?? [] },
        { name: 'simulated', x: trajectory.time, y: trajectory.simulated[c] ?? [], dashed: true },
      ],
    }),
  );
  charts.push(
    lineChartSvg({
      title: `${figures.recording}: error over time (simulated - recorded)`,
      xLabel: 'time',
      yLabel: 'error',
      series: coordinates.map((c) => ({ name: c, x: trajectory.time, y: trajectory.error[c] ?? [] })),
    }),
  );
  return charts.map((svg) => `<figure>${svg}</figure>`).join('\n');
}

/** The residual's size relative to what it balances: the input power when there is any, else the energy's parts. */
function relativeResidual(r: FitResiduals['recordings'][number]): string {
  if (r.powerRms > 0) return `${number(r.rms / r.powerRms, 3)} of the power`;
  return r.partsRms > 0 ? `${number(r.rms / r.partsRms, 3)} of the energy's parts` : '–';
}

function residualSection(residuals: FitResiduals | undefined): string {
  if (!residuals) return '<p class="muted">Not worked out for this model.</p>';
  if (residuals.recordings.length === 0) return '<p class="muted">No recording could be used.</p>';
  const rows = residuals.recordings.map(
    (r) =>
      `<tr><td>${esc(r.recording)} (${r.role})</td><td class="number">${r.rows}</td><td class="number">${number(r.rms)}</td><td class="number">${number(r.max)}</td><td>${esc(relativeResidual(r))}</td></tr>`,
  );
  const derivative = residuals.form === 'derivative';
  const how = derivative
    ? 'Derivative form: per sample, the rate of change of the fitted energy less the input power (Gamma c - P).'
    : `Balance form: per window of ${residuals.balance?.window ?? '?'} sample intervals every ${residuals.balance?.stride ?? '?'} samples, the change of the fitted energy less the integrated input power, plotted at the end of the window.`;
  const chart = lineChartSvg({
    title: 'Fit residual over time',
    xLabel: 'time',
    yLabel: derivative ? 'dE/dt - P' : 'change of E - integral of P',
    series: residuals.recordings.map((r) => ({ name: r.recording, x: r.time, y: r.residual })),
  });
  return `<p class="muted">${esc(how)} The rms is taken over every row; the plot is thinned.</p>
<table><thead><tr><th>recording</th><th>rows</th><th>rms</th><th>largest</th><th>rms relative</th></tr></thead><tbody>${rows.join('')}</tbody></table>
<figure>${chart}</figure>`;
}

/**
 * The printable report page of a model (work it out first with workOutModelDetails): caution, energy,
 * Lagrangian, equations of motion as plain math and as LaTeX source, coefficient table, the fit's
 * energy-balance residual per recording with its plot, mass-matrix check, validation figures, plots of simulated against recorded trajectories and of the error over time, warnings,
 * provenance. Pure: returns the HTML text.
 */
export function exportReport(details: ModelDetails): string {
  const { document } = details;
  const title = document.title ?? 'Conserva model';
  const provenance = document.provenance;
  const settings = details.settings;
  const estimator = settings.estimator.method === 'central' ? 'central differences' : `Savitzky-Golay, window ${settings.estimator.window}, order ${settings.estimator.order}`;
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<title>${esc(title)}</title>
<style>${styles}</style>
</head>
<body>
<h1>${esc(title)}</h1>
<p class="muted">Coordinates ${document.coordinates.map((c) => `<code>${esc(c)}</code>`).join(', ')}; velocities written d&lt;name&gt;. Model document ${esc(document.format)} version ${document.version}${document.createdAt ? `, ${esc(document.createdAt)}` : ''}; from ${esc(provenance.source)}${provenance.recordings.length > 0 ? `, recordings ${provenance.recordings.map((r) => `${esc(r.name)} (${r.role})`).join(', ')}` : ''}.</p>
<p class="caution">${esc(details.caution)}</p>

<h2>Energy and Lagrangian</h2>
<pre>E = ${esc(document.energy.expression)}</pre>
<pre>L = ${esc(document.lagrangian.expression)}</pre>
${coefficientTable(details)}

<h2>Equations of motion</h2>
${equationsBlock(details)}

<h2>Fit residual of the energy balance</h2>
${residualSection(details.fitResiduals)}

<h2>Mass matrix on the recorded states</h2>
${massMatrixTable(details.massMatrixChecks)}

<h2>Simulation against recordings</h2>
<p class="muted">Simulated from each recording's initial state, driven by its recorded forces (${esc(settings.forceInterpolation)} between samples); initial velocity by ${esc(estimator)}; integrator tolerance ${number(settings.rtol)}.</p>
${validationTable(details.validations)}
${details.validations.map((check) => plots(check, document.coordinates)).join('\n')}

${details.warnings.length > 0 ? `<h2>Warnings</h2>\n<ul class="warnings">${details.warnings.map((w) => `<li>${esc(w)}</li>`).join('')}</ul>` : ''}
<p class="caution">${esc(details.caution)}</p>
</body>
</html>
`;
}

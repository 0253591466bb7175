// The explorer page: plain JavaScript, written by hand, no build step and no library.
// Every figure comes from the taut that served this page (same library calls as the CLI);
// the page only lays them out, plays the partials it is given, and saves downloads.
'use strict';

const S = {
  origin: 'instrument.yaml', yaml: '', doc: null, start: null, plan: null, planReply: null,
  generation: 0, steps: {}, removedKinds: {}, changedAt: 0, audio: null, voices: [], lastSet: null,
};
const $ = (id) => document.getElementById(id);

// ---------- talking to the server ----------
async function api(name, body) {
  const response = await fetch('api/' + name, {
    method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body || {}),
  });
  const type = response.headers.get('Content-Type') || '';
  if (!type.startsWith('application/json')) {
    return { ok: response.ok, blob: await response.blob(), name: fileName(response) };
  }
  const data = await response.json();
  // The library's refusals of the input arrive as answers (`refused`), shown inline.
  if (!response.ok) return { ok: false, error: data.error };
  return data.refused ? { ok: false, error: data.refused } : { ok: true, data };
}
function fileName(response) {
  const m = /filename="([^"]+)"/.exec(response.headers.get('Content-Disposition') || '');
  return m ? m[1] : 'taut-download';
}

// ---------- small helpers ----------
function el(tag, attrs, ...children) {
  const node = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs || {})) {
    if (k === 'class') node.className = v;
    else if (k.startsWith('on')) node.addEventListener(k.slice(2), v);
    else node.setAttribute(k, v);
  }
  for (const c of children) if (c !== null && c !== undefined) node.append(c);
  return node;
}
function fixed(x, d) { return Number.isFinite(x) ? x.toFixed(d) : '–'; }
function debounce(fn, ms) { let t = 0; return (...a) => { clearTimeout(t); t = setTimeout(() => fn(...a), ms); }; }
function status(text) { $('status').textContent = text; }
// Maps travel as ordered lists of {k, v}, so the YAML keeps its key order.
const isMap = (v) => Array.isArray(v) && v.length > 0 && v.every((e) => e && typeof e === 'object' && !Array.isArray(e) && 'k' in e && 'v' in e);
function mget(map, key) { const e = isMap(map) ? map.find((x) => x.k === key) : null; return e ? e.v : undefined; }
function mset(map, key, value) {
  const i = map.findIndex((x) => x.k === key);
  if (value === undefined || value === '') { if (i >= 0) map.splice(i, 1); return; }
  if (i >= 0) map[i].v = value; else map.push({ k: key, v: value });
}
function errorText(e) {
  if (!e) return '';
  const where = [];
  if (e.origin) where.push(e.origin);
  if (e.line) where.push('line ' + e.line + (e.column ? ', column ' + e.column : ''));
  if (e.field) where.push('field `' + e.field + '`');
  return (where.length ? where.join(', ') + ': ' : '') + e.message + (e.help ? '\nhelp: ' + e.help : '');
}
function showError(box, e) {
  box.hidden = !e;
  box.textContent = '';
  if (e) { box.append(el('b', {}, 'Not read: '), errorText(e)); }
}

// ---------- the form ----------
const TOP_FIELDS = [
  ['name', 'Name'], ['description', 'Description'], ['tuning', 'Own tuning'],
  ['scale_length', 'Scale length'], ['rated_load', 'Rated load'], ['tolerance', 'Tolerance'],
];
const DEFAULT_FIELDS = [['tension', 'Tension'], ['max_diameter', 'Widest string']];
const COURSE_FIELDS = ['pitch', 'scale_length', 'tension', 'kinds'];

function scalarText(v) {
  if (v === undefined || v === null) return '';
  if (typeof v === 'string' || typeof v === 'number') return String(v);
  if (Array.isArray(v) && v.every((x) => typeof x === 'string')) return v.join(', ');
  return null; // a mapping or list: edited in the YAML
}
function summary(v) {
  if (isMap(v)) return '{' + v.map((e) => e.k + ': ' + (scalarText(e.v) ?? '…')).join(', ') + '}';
  return '…';
}
function fieldInput(map, key, label, parse) {
  const v = mget(map, key);
  const text = scalarText(v);
  if (text === null) return el('label', {}, label, el('span', { class: 'fixed' }, summary(v) + ' (edit in YAML)'));
  const input = el('input', { type: 'text', value: text, 'data-field': key });
  input.addEventListener('input', () => { mset(map, key, parse ? parse(input.value) : input.value.trim()); formChanged(); });
  return el('label', {}, label, input);
}
const kindList = (text) => { const list = text.split(',').map((s) => s.trim()).filter(Boolean); return list.length ? list : undefined; };

function renderForm() {
  const form = $('form');
  form.textContent = '';
  const doc = S.doc;
  if (!isMap(doc)) { form.append(el('p', { class: 'note' }, 'The YAML does not read as an instrument yet.')); return; }
  for (const [key, label] of TOP_FIELDS) form.append(fieldInput(doc, key, label));
  let defaults = mget(doc, 'defaults');
  if (!isMap(defaults)) { defaults = []; }
  const attachDefaults = () => { if (!mget(doc, 'defaults') && defaults.length) mset(doc, 'defaults', defaults); };
  for (const [key, label] of DEFAULT_FIELDS) {
    const node = fieldInput(defaults, key, label);
    node.addEventListener('input', attachDefaults);
    form.append(node);
  }
  const allowed = new Set(Array.isArray(mget(defaults, 'kinds')) ? mget(defaults, 'kinds') : []);
  const kinds = el('div', { class: 'kinds' });
  for (const id of (S.start ? S.start.kinds : [])) {
    const box = el('input', { type: 'checkbox', 'data-kind': id });
    box.checked = allowed.has(id);
    box.addEventListener('change', () => {
      const now = S.start.kinds.filter((k) => kinds.querySelector(`[data-kind="${k}"]`).checked);
      mset(defaults, 'kinds', now.length ? now : undefined);
      attachDefaults();
      formChanged();
    });
    kinds.append(el('label', {}, box, id));
  }
  form.append(el('label', {}, 'Allowed kinds', kinds));
  const courses = mget(doc, 'courses');
  form.append(el('h3', {}, 'Courses'));
  if (!Array.isArray(courses)) return;
  const body = el('tbody');
  courses.forEach((course, index) => {
    if (!isMap(course)) return;
    const row = el('tr', {}, el('td', {}, String(mget(course, 'course') ?? index + 1)));
    for (const key of COURSE_FIELDS) {
      const v = mget(course, key);
      const text = scalarText(v);
      if (text === null) { row.append(el('td', { class: 'fixed' }, 'YAML')); continue; }
      const input = el('input', { type: 'text', value: text, 'data-course': String(index), 'data-field': key });
      input.addEventListener('input', () => {
        mset(course, key, key === 'kinds' ? kindList(input.value) : (input.value.trim() || undefined));
        formChanged();
      });
      row.append(el('td', {}, input));
    }
    row.append(el('td', {}, el('button', { type: 'button', title: 'remove this course', onclick: () => { courses.splice(index, 1); renderForm(); formChanged(); } }, '−')));
    body.append(row);
  });
  form.append(el('table', {}, el('thead', {}, el('tr', {}, el('th', {}, '#'), el('th', {}, 'pitch'), el('th', {}, 'length'), el('th', {}, 'tension'), el('th', {}, 'kinds'), el('th', {}))), body));
  form.append(el('button', { type: 'button', onclick: () => {
    const last = courses[courses.length - 1];
    courses.push(isMap(last) ? JSON.parse(JSON.stringify(last)).filter((e) => e.k !== 'course' && e.k !== 'string') : [{ k: 'pitch', v: 'A4' }]);
    renderForm(); formChanged();
  } }, '+ course'));
}

const writeSoon = debounce(async () => {
  const reply = await api('write', { document: S.doc, origin: S.origin });
  if (!reply.ok) { showError($('yaml-error'), reply.error); return; }
  S.yaml = reply.data.yaml;
  $('yaml').value = S.yaml;
  showError($('yaml-error'), reply.data.error);
  if (!reply.data.error) planNow();
}, 60);
function formChanged() { S.changedAt = performance.now(); writeSoon(); }

const readSoon = debounce(async () => {
  S.yaml = $('yaml').value;
  const reply = await api('read', { yaml: S.yaml, origin: S.origin });
  if (!reply.ok) { showError($('yaml-error'), reply.error); return; }
  showError($('yaml-error'), reply.data.error);
  if (reply.data.document) { S.doc = reply.data.document; renderForm(); }
  if (!reply.data.error) planNow();
}, 120);

// ---------- the tuning ----------
function tuningSpec() {
  const mode = $('tuning-mode').value;
  let base;
  if (mode === 'own') base = (isMap(S.doc) && typeof mget(S.doc, 'tuning') === 'string') ? mget(S.doc, 'tuning') : '12edo';
  else if (mode === 'edo') base = Math.max(1, Math.round(Number($('edo').value) || 12)) + 'edo';
  else if (mode === 'custom') base = $('custom-spec').value.trim();
  else base = mode; // a shipped tuning by name
  const ref = Number($('ref-hz').value) || 440;
  const offset = Number($('offset').value) || 0;
  if ((ref === 440 && offset === 0) || base.includes('@')) return base;
  const hz = ref * Math.pow(2, offset / 1200);
  return base + '@A4=' + String(Number(hz.toFixed(4)));
}
function tuningChanged() {
  const mode = $('tuning-mode').value;
  $('edo-box').hidden = mode !== 'edo';
  $('custom-box').hidden = mode !== 'custom';
  S.changedAt = performance.now();
  planNow();
}

// ---------- the plan ----------
async function planNow() {
  const generation = ++S.generation;
  const spec = tuningSpec();
  const reply = await api('plan', { instrument: S.yaml, origin: S.origin, tuning: spec, charts: true });
  if (generation !== S.generation) return; // a newer change is on its way
  if (!reply.ok) {
    showError($('plan-error'), reply.error);
    if (reply.error && reply.error.line) showError($('yaml-error'), reply.error);
    $('results-card').classList.add('stale');
    return;
  }
  showError($('plan-error'), null);
  S.planReply = reply.data;
  S.plan = reply.data.plan;
  renderPlan();
  const ms = S.changedAt ? performance.now() - S.changedAt : 0;
  window.tautLastUpdateMs = ms;
  $('timing').textContent = S.changedAt ? `updated ${ms.toFixed(1)} ms after the change` : '';
  document.body.dataset.planned = String(generation);
  refreshSide();
}

function choicesOf(string) {
  const a = string.alternatives || {};
  const list = [];
  if (a.thinner) list.push(a.thinner);
  list.push(string);
  if (a.thicker) list.push(a.thicker);
  for (const other of a.other_kinds || []) list.push(other);
  return list;
}
function stressBar(ratio) {
  const p = S.plan;
  const cls = ratio >= p.danger_stress_ratio ? 'danger' : ratio >= p.caution_stress_ratio ? 'caution' : '';
  return el('span', {}, el('span', { class: 'bar ' + cls }, el('i', { style: `width:${Math.min(100, ratio * 100).toFixed(0)}%` })), fixed(ratio * 100, 0) + '%');
}
function severityOf(course, index) {
  let worst = '';
  for (const w of course.warnings) if (w.string === index + 1 || w.string === null) {
    if (w.severity === 'danger') worst = 'danger'; else if (w.severity === 'caution' && worst !== 'danger') worst = 'caution';
  }
  return worst;
}

function renderPlan() {
  const r = S.planReply, p = S.plan;
  $('spec').textContent = r.tuning_spec;
  $('command').textContent = r.command;
  const cautions = $('cautions');
  cautions.hidden = r.cautions.length === 0;
  cautions.textContent = '';
  if (r.cautions.length) cautions.append(el('h4', {}, 'Take care: some strings reach caution or danger'), el('ul', {}, ...r.cautions.map((c) => el('li', {}, c))));
  // Total load against the rating.
  const load = $('load');
  load.textContent = '';
  if (p.rated_load_n) {
    const share = p.total_tension_n / p.rated_load_n;
    load.append(el('div', {}, `Total load ${fixed(p.total_tension_n, 0)} N, ${fixed(share * 100, 0)}% of the rated ${fixed(p.rated_load_n, 0)} N`),
      el('div', { class: 'meter' + (share > 1 ? ' over' : '') }, el('i', { style: `width:${Math.min(100, share * 100).toFixed(1)}%` })));
  } else {
    load.append(el('div', {}, `Total load ${fixed(p.total_tension_n, 0)} N (the file gives no rated load)`));
  }
  const body = $('plan-table').tBodies[0];
  body.textContent = '';
  p.courses.forEach((course, ci) => {
    course.strings.forEach((string, si) => {
      const key = ci + ':' + si;
      const choices = choicesOf(string);
      const chosenAt = choices.indexOf(string);
      const at = Math.max(0, Math.min(choices.length - 1, S.steps[key] ?? chosenAt));
      const shown = choices[at];
      const preview = at !== chosenAt;
      const pinned = string.standing === 'fixed';
      const sev = severityOf(course, si);
      const cells = [
        el('td', {}, si === 0 ? String(course.course) : ''),
        el('td', {}, si === 0 ? course.pitch_label + (course.note_name && course.note_name !== course.pitch_label ? ' ≈' + course.note_name : '') : string.interval),
        el('td', { class: 'num' }, fixed(string.pitch_hz, 2)),
        el('td', { class: 'num' }, si === 0 ? fixed(course.length_m * 1000, 0) + ' mm' : ''),
        el('td', {}, `${shown.kind} ${shown.gauge}`),
        el('td', { class: 'num ' + (sev ? 'sev-' + sev : '') }, fixed(shown.tension_n, 1) + ' N'),
        el('td', { class: 'num' }, fixed(string.target_tension_n, 1) + ' N'),
        el('td', {}, stressBar(shown.stress_ratio)),
        el('td', {}, pinned ? 'pinned' : preview ? 'alternative ' + (at + 1) + '/' + choices.length : (string.standing || '').replace(/_/g, ' ')),
      ];
      const controls = el('td', {});
      if (pinned) {
        controls.append(el('button', { type: 'button', 'data-unpin': key, onclick: () => unpin(ci, si) }, 'unpin'));
      } else {
        controls.append(
          el('button', { type: 'button', title: 'previous alternative', 'data-step': key + ':-1', onclick: () => { S.steps[key] = Math.max(0, at - 1); renderPlan(); } }, '◂'),
          el('button', { type: 'button', title: 'next alternative', 'data-step': key + ':1', onclick: () => { S.steps[key] = Math.min(choices.length - 1, at + 1); renderPlan(); } }, '▸'),
          el('button', { type: 'button', title: 'keep this string (fixed in the file)', 'data-pin': key, onclick: () => pin(ci, si, shown) }, 'pin'));
      }
      cells.push(controls, el('td', {}, el('button', { type: 'button', title: 'play this course', onclick: () => play('courses:' + course.course) }, '♪')));
      body.append(el('tr', { class: (preview ? 'preview ' : '') + (pinned ? 'pinned' : ''), 'data-course': String(course.course), 'data-string': String(si + 1) }, ...cells));
    });
  });
  // The gauge line, as the CLI writes it in millimetres: `+` joins a course's strings, `w` marks wound.
  $('gauges').textContent = 'Gauges (mm, w = wound): ' + p.courses.map((c) => c.strings.map((s) => s.diameter_mm.toFixed(3) + (s.construction === 'wound' ? 'w' : '')).join('+')).join(' ');
  const charts = $('charts');
  charts.textContent = '';
  for (const chart of r.charts) {
    const figure = el('figure', { 'data-chart': chart.name });
    figure.innerHTML = chart.svg; // drawn by the library's chart builder; user text in it is cleaned there
    charts.append(figure);
  }
  const warnings = $('warnings');
  warnings.textContent = '';
  for (const w of p.warnings) {
    warnings.append(el('li', { class: 'sev-' + w.severity }, (w.course ? `course ${w.course}${w.string ? '/' + w.string : ''}: ` : '') + w.message));
  }
  $('reminder').textContent = r.cautions.length ? '' : r.reminder;
}

// ---------- pinning a string: written into the instrument as a fixed string ----------
function courseMap(ci) { const courses = mget(S.doc, 'courses'); return Array.isArray(courses) ? courses[ci] : null; }
function pin(ci, si, choice) {
  const course = courseMap(ci);
  if (!isMap(course)) return;
  const fixedString = [{ k: 'kind', v: choice.kind }, { k: 'diameter', v: String(Number(choice.diameter_mm.toFixed(4))) + 'mm' }];
  const strings = mget(course, 'strings');
  if (!Array.isArray(strings) || strings.length <= 1) {
    if (mget(course, 'kinds') !== undefined) S.removedKinds[ci] = mget(course, 'kinds');
    mset(course, 'kinds', undefined);
    if (Array.isArray(strings) && isMap(strings[0])) mset(strings[0], 'kinds', undefined);
    mset(course, 'string', fixedString);
  } else {
    let entry = strings[si];
    if (!isMap(entry)) entry = [{ k: 'interval', v: String(entry) }];
    mset(entry, 'kinds', undefined);
    mset(entry, 'string', fixedString);
    strings[si] = entry;
  }
  delete S.steps[ci + ':' + si];
  renderForm();
  formChanged();
}
function unpin(ci, si) {
  const course = courseMap(ci);
  if (!isMap(course)) return;
  const strings = mget(course, 'strings');
  if (Array.isArray(strings) && strings.length > 1 && isMap(strings[si])) mset(strings[si], 'string', undefined);
  else { mset(course, 'string', undefined); if (S.removedKinds[ci]) mset(course, 'kinds', S.removedKinds[ci]); }
  renderForm();
  formChanged();
}

// ---------- frets, survey map, audit: refreshed after each plan ----------
function refreshSide() { fretsNow(); if ($('sv-live').checked) surveySoon(); }

async function fretsNow() {
  const reply = await api('frets', { instrument: S.yaml, origin: S.origin, tuning: tuningSpec() });
  const box = $('frets-drawing');
  box.textContent = '';
  if (!reply.ok) { $('frets-note').textContent = 'No frets: ' + errorText(reply.error); return; }
  const { layout, drawing } = reply.data;
  const count = layout.courses.reduce((n, c) => n + c.frets.length, 0);
  $('frets-note').textContent = `${count} frets over ${layout.courses.length} courses; ${layout.warnings.length} notes. ${layout.compensation}.`;
  if (!drawing) return;
  const xs = drawing.outline.map((p) => p[0]), ys = drawing.outline.map((p) => p[1]);
  const minX = Math.min(...xs), maxX = Math.max(...xs), minY = Math.min(...ys), maxY = Math.max(...ys);
  const pad = 0.01, w = maxX - minX + 2 * pad, h = maxY - minY + 2 * pad;
  const ns = 'http://www.w3.org/2000/svg';
  const svg = document.createElementNS(ns, 'svg');
  svg.setAttribute('viewBox', `${minX - pad} ${minY - pad} ${w} ${h}`);
  svg.setAttribute('role', 'img');
  const line = (l, stroke, width) => {
    const n = document.createElementNS(ns, 'line');
    n.setAttribute('x1', l[0][0]); n.setAttribute('y1', l[0][1]); n.setAttribute('x2', l[1][0]); n.setAttribute('y2', l[1][1]);
    n.setAttribute('stroke', stroke); n.setAttribute('stroke-width', width); svg.append(n);
  };
  const outline = document.createElementNS(ns, 'polygon');
  outline.setAttribute('points', drawing.outline.map((p) => `${p[0]},${p[1]}`).join(' '));
  outline.setAttribute('fill', '#e9dcc0'); outline.setAttribute('stroke', '#1d3b36'); outline.setAttribute('stroke-width', 0.0015);
  svg.append(outline);
  line(drawing.nut, '#1d3b36', 0.003);
  for (const f of drawing.frets) line(f.line, f.close ? '#9e2f22' : '#6b5a3a', 0.0012);
  for (const [, s] of drawing.strings) line(s, '#1f2a2e', 0.0006);
  if (drawing.body_joint) line(drawing.body_joint, '#b87a12', 0.0015);
  box.append(svg);
}

const surveySoon = debounce(surveyNow, 250);
async function surveyNow() {
  if (!S.plan) return;
  if (!$('sv-course1').value) $('sv-course1').value = S.plan.courses[0].note_name;
  if (!$('sv-nearest').value) $('sv-nearest').value = defaultStep();
  const reply = await api('survey', {
    instrument: S.yaml, origin: S.origin, course_1: $('sv-course1').value.trim(),
    edos: { from: Number($('sv-from').value), to: Number($('sv-to').value) },
    offsets: { from: Number($('sv-ofrom').value), to: Number($('sv-oto').value), step: Number($('sv-ostep').value) },
    courses: { nearest_to: $('sv-nearest').value.trim() },
  });
  const map = $('survey-map');
  map.textContent = '';
  if (!reply.ok) { $('survey-note').textContent = errorText(reply.error); return; }
  drawMap(map, reply.data);
}
// The interval between the first two courses, in cents, as the map's default course pattern.
function defaultStep() {
  const c = S.plan.courses;
  if (c.length < 2) return '2/1';
  return Math.abs(1200 * Math.log2(c[1].pitch_hz / c[0].pitch_hz)).toFixed(1) + 'c';
}
function drawMap(box, data) {
  const ns = 'http://www.w3.org/2000/svg';
  const cell = 12, left = 64, top = 18;
  const width = Math.max(560, left + data.offsets.length * cell + 10), height = top + data.rows.length * cell + 30;
  const svg = document.createElementNS(ns, 'svg');
  svg.setAttribute('viewBox', `0 0 ${width} ${height}`);
  svg.setAttribute('width', width);
  const text = (x, y, t, anchor) => { const n = document.createElementNS(ns, 'text'); n.setAttribute('x', x); n.setAttribute('y', y); n.setAttribute('font-size', '9'); n.setAttribute('text-anchor', anchor || 'start'); n.textContent = t; svg.append(n); };
  data.offsets.forEach((o, j) => { if (j % 5 === 0) text(left + j * cell + cell / 2, top - 6, (o > 0 ? '+' : '') + o, 'middle'); });
  data.rows.forEach((row, i) => {
    text(left - 4, top + i * cell + 9, row.spec, 'end');
    row.verdicts.forEach((v, j) => {
      const r = document.createElementNS(ns, 'rect');
      r.setAttribute('x', left + j * cell); r.setAttribute('y', top + i * cell);
      r.setAttribute('width', cell - 1); r.setAttribute('height', cell - 1);
      // Three looks that differ in lightness too: solid dark, mid with a dot, pale.
      r.setAttribute('fill', v === 2 ? '#2f6b45' : v === 1 ? '#d9a441' : '#ece4d3');
      const title = document.createElementNS(ns, 'title');
      title.textContent = `${row.spec}, ${data.offsets[j]} cents: ${v === 2 ? 'stringable' : v === 1 ? 'stringable with care' : 'not stringable'}`;
      r.append(title); svg.append(r);
      if (v === 1) { const d = document.createElementNS(ns, 'circle'); d.setAttribute('cx', left + j * cell + cell / 2 - 0.5); d.setAttribute('cy', top + i * cell + cell / 2 - 0.5); d.setAttribute('r', 1.6); d.setAttribute('fill', '#1f2a2e'); svg.append(d); }
    });
  });
  text(left, height - 8, 'dark: stringable · amber with dot: with care · pale: not stringable · columns: offset of course 1 in cents');
  box.append(svg);
  const best = data.best[0];
  $('survey-note').textContent = `${data.stringable} of ${data.candidates} settings stringable.` + (best ? ` Smallest tension spread: ${best.tuning} at ${best.offset_cents > 0 ? '+' : ''}${best.offset_cents} cents.` : '') + ' ' + data.notes.join(' ');
  S.surveySettings = data.settings;
}

async function auditNow(setText, setOrigin) {
  S.lastSet = { setText, setOrigin };
  const reply = await api('audit', { instrument: S.yaml, origin: S.origin, tuning: tuningSpec(), set: setText, set_origin: setOrigin });
  const box = $('audit');
  box.textContent = '';
  if (!reply.ok) { box.append(el('div', { class: 'inline-error' }, el('b', {}, 'Not read: '), errorText(reply.error))); return; }
  const a = reply.data;
  box.append(el('p', {}, `${a.set} on ${a.instrument} in ${a.tuning}: ${a.courses_ok} of ${a.courses.length} courses fit. Total ${fixed(a.total_tension_n, 0)} N.`));
  if (a.cautions.length) box.append(el('div', { class: 'cautions' }, el('h4', {}, 'Take care'), el('ul', {}, ...a.cautions.map((c) => el('li', {}, c)))));
  const rows = a.courses.map((c) => el('tr', {}, el('td', {}, String(c.course)), el('td', {}, c.pitch_label || c.pitch || ''), el('td', {}, c.verdict),
    el('td', {}, c.strings.map((s) => `${s.string} ${fixed(s.tension_n, 1)} N`).join(' + '))));
  box.append(el('table', {}, el('thead', {}, el('tr', {}, el('th', {}, 'course'), el('th', {}, 'pitch'), el('th', {}, 'verdict'), el('th', {}, 'strings'))), el('tbody', {}, ...rows)));
  box.append(el('ul', { class: 'warnings' }, ...a.warnings.map((w) => el('li', { class: 'sev-' + w.severity }, w.message))));
}

// ---------- sound: oscillators from the partials the library gives ----------
function stopSound() { for (const v of S.voices) { try { v.stop(); } catch (_) { /* already ended */ } } S.voices = []; }
async function play(what) {
  const Ctx = window.AudioContext || window.webkitAudioContext;
  if (!S.audio) S.audio = new Ctx();
  const ctx = S.audio;
  if (ctx.state === 'suspended') await ctx.resume();
  const reply = await api('sound', {
    instrument: S.yaml, origin: S.origin, tuning: tuningSpec(), play: what,
    seconds: Number($('seconds').value) || 2.5, pluck: Number($('pluck').value) || 0.15,
    stiff: !$('harmonic').checked, sample_rate_hz: ctx.sampleRate,
  });
  if (!reply.ok) { $('sound-status').textContent = 'Cannot play: ' + errorText(reply.error); return; }
  stopSound();
  const notes = reply.data.notes;
  const master = ctx.createGain();
  const together = Math.max(1, ...notes.map((n) => notes.filter((m) => Math.abs(m.start_s - n.start_s) < 0.5).length));
  master.gain.value = 0.5 / Math.sqrt(together);
  const compressor = ctx.createDynamicsCompressor();
  master.connect(compressor); compressor.connect(ctx.destination);
  const t0 = ctx.currentTime + 0.05;
  let partials = 0;
  for (const note of notes) {
    const start = t0 + note.start_s, end = start + note.duration_s;
    for (const p of note.partials) {
      const osc = ctx.createOscillator();
      osc.frequency.value = p.hz;
      const gain = ctx.createGain();
      gain.gain.setValueAtTime(0, start);
      gain.gain.linearRampToValueAtTime(p.amplitude, start + 0.002);
      gain.gain.setTargetAtTime(0, start + 0.002, 1 / p.decay_per_s); // e^(−σt)
      gain.gain.setTargetAtTime(0, end, 0.03);                         // a short release
      osc.connect(gain); gain.connect(master);
      osc.start(start); osc.stop(end + 0.25);
      S.voices.push(osc);
      partials += 1;
    }
  }
  const status = `Playing ${notes.length} note${notes.length === 1 ? '' : 's'} from ${partials} partials (${what}).`;
  $('sound-status').textContent = status;
  document.body.dataset.played = String(partials);
}

// ---------- files: downloads made in the browser, opening by picking or dropping ----------
function save(blob, name) {
  const url = URL.createObjectURL(blob);
  const a = el('a', { href: url, download: name });
  document.body.append(a); a.click(); a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 5000);
  $('download-note').textContent = 'Saved ' + name + '.';
}
async function download(what) {
  if (what === 'instrument') { save(new Blob([S.yaml], { type: 'application/yaml' }), S.origin.replace(/\.(ya?ml|json)$/i, '') + '.yaml'); return; }
  const reply = await api('export', { what, plan: { instrument: S.yaml, origin: S.origin, tuning: tuningSpec() } });
  if (!reply.ok || !reply.blob) { $('download-note').textContent = 'Not made: ' + errorText(reply.error); return; }
  save(reply.blob, reply.name);
}
async function openInstrument(text, name) {
  S.origin = name || 'instrument.yaml';
  S.yaml = text;
  $('yaml').value = text;
  S.steps = {};
  S.changedAt = performance.now();
  const reply = await api('read', { yaml: text, origin: S.origin });
  if (!reply.ok) { showError($('yaml-error'), reply.error); return; }
  S.doc = reply.data.document;
  showError($('yaml-error'), reply.data.error);
  renderForm();
  $('sv-course1').value = ''; $('sv-nearest').value = '';
  status(S.origin);
  if (!reply.data.error) planNow();
}
function readFile(file, then) { const r = new FileReader(); r.onload = () => then(String(r.result), file.name); r.readAsText(file); }

// ---------- start ----------
async function startPage() {
  const reply = await api('start', {});
  if (!reply.ok) { status('cannot start: ' + errorText(reply.error)); return; }
  S.start = reply.data;
  for (const name of S.start.examples) $('example-pick').append(el('option', { value: name }, name));
  const modes = $('tuning-mode');
  const group = el('optgroup', { label: 'shipped tunings' });
  for (const name of S.start.tunings) group.append(el('option', { value: name }, name));
  modes.append(group);
  $('yaml').addEventListener('input', () => { S.changedAt = performance.now(); readSoon(); });
  $('example-pick').addEventListener('change', async (e) => {
    if (!e.target.value) return;
    const r = await api('example', { name: e.target.value });
    if (r.ok) openInstrument(r.data.instrument, r.data.origin);
  });
  $('file-pick').addEventListener('change', (e) => { if (e.target.files[0]) readFile(e.target.files[0], openInstrument); });
  $('set-pick').addEventListener('change', (e) => { if (e.target.files[0]) readFile(e.target.files[0], auditNow); });
  $('set-from-plan').addEventListener('click', async () => {
    const r = await api('export', { what: 'set-yaml', plan: { instrument: S.yaml, origin: S.origin, tuning: tuningSpec() } });
    if (r.ok && r.blob) auditNow(await r.blob.text(), 'planned-set.yaml');
  });
  $('tuning-mode').addEventListener('change', tuningChanged);
  const pair = (a, b) => {
    $(a).addEventListener('input', () => { $(b).value = $(a).value; tuningChanged(); });
    $(b).addEventListener('input', () => { $(a).value = $(b).value; tuningChanged(); });
  };
  pair('edo', 'edo-slide');
  pair('offset', 'offset-slide');
  for (const id of ['ref-hz', 'custom-spec']) $(id).addEventListener('input', tuningChanged);
  for (const id of ['sv-from', 'sv-to', 'sv-ofrom', 'sv-oto', 'sv-ostep', 'sv-course1', 'sv-nearest']) $(id).addEventListener('change', surveyNow);
  $('play-strum').addEventListener('click', () => play('strum'));
  $('play-strings').addEventListener('click', () => play('strings'));
  $('play-scale').addEventListener('click', () => play('scale'));
  $('play-chord').addEventListener('click', () => play('courses:' + $('chord').value.replace(/\s+/g, '')));
  $('play-stop').addEventListener('click', stopSound);
  for (const button of document.querySelectorAll('[data-download]')) button.addEventListener('click', () => download(button.dataset.download));
  // Dropping a file: on the set card it is a set to check; anywhere else, an instrument.
  document.addEventListener('dragover', (e) => { e.preventDefault(); document.body.classList.add('dragging'); });
  document.addEventListener('dragleave', () => document.body.classList.remove('dragging'));
  document.addEventListener('drop', (e) => {
    e.preventDefault();
    document.body.classList.remove('dragging');
    const file = e.dataTransfer.files[0];
    if (!file) return;
    if (e.target.closest && e.target.closest('#audit-card')) readFile(file, auditNow); else readFile(file, openInstrument);
  });
  await openInstrument(S.start.instrument, S.start.origin);
}
startPage();

// drumloop live page: values by server-sent events, commands as JSON POSTs.
// Plain browser JavaScript, no libraries, works offline.
'use strict';

const S = {
  info: null, run: null, seq: 0, values: null, history: [], syncing: false,
  es: null, lastMessageMs: 0, connected: false,
  view: { windowS: 600, zoom: null, drag: null },
  dirty: true
};
const HISTORY_KEEP_S = 660;
const STALE_AFTER_MS = 3000;

const $ = (id) => document.getElementById(id);
const fmt = (v, d) => (v === null || v === undefined || Number.isNaN(v)) ? '-' : Number(v).toFixed(d);
function setText(id, text) { const e = $(id); if (e && e.textContent !== text) e.textContent = text; }

// ---- connection ------------------------------------------------------------------------------

async function loadState() {
  S.syncing = true;
  try {
    const r = await fetch('api/state', { cache: 'no-store' });
    const st = await r.json();
    if (S.run !== st.run || !S.info) {
      setupInfo(st.info);
    }
    S.run = st.run;
    S.seq = st.seq;
    S.history = st.history;
    const rows = $('event-rows');
    rows.textContent = '';
    for (const e of st.events) addEvent(e);
    if (st.message) render(st.message.values);
    S.dirty = true;
  } finally {
    S.syncing = false;
  }
}

function connect() {
  if (S.es) S.es.close();
  const es = new EventSource('api/stream');
  S.es = es;
  es.onopen = () => { loadState().catch(() => {}); };
  es.onmessage = (ev) => {
    S.lastMessageMs = Date.now();
    setConnected(true);
    if (S.syncing) return;
    const m = JSON.parse(ev.data);
    if (m.seq <= S.seq && m.run === S.run) return; // already in the state we loaded
    if (m.run !== S.run || m.seq !== S.seq + 1) { loadState().catch(() => {}); return; }
    S.seq = m.seq;
    const v = m.values;
    const last = S.history[S.history.length - 1];
    if (!last || v.t_s > last[0]) {
      S.history.push([v.t_s, v.level_mm, v.level_true_mm, steamOf(v), feedOf(v), v.valve_pct, v.pressure_barg, v.setpoint_mm]);
      while (S.history.length && S.history[0][0] < v.t_s - HISTORY_KEEP_S) S.history.shift();
    }
    for (const e of m.events) addEvent(e);
    render(v);
    S.dirty = true;
  };
  es.onerror = () => {
    setConnected(false);
    // the browser retries by itself while CONNECTING; when it has given up, start a new stream
    if (es.readyState === EventSource.CLOSED) setTimeout(connect, 1000);
  };
}

function setConnected(ok) {
  S.connected = ok;
  const c = $('conn');
  c.textContent = ok ? 'connected' : 'connection lost - reconnecting';
  c.className = 'conn ' + (ok ? 'ok' : 'bad');
  document.body.classList.toggle('stale', !ok);
}

// watchdog: no message for a while means the server is gone or stuck; reconnect ourselves
setInterval(() => {
  if (Date.now() - S.lastMessageMs > STALE_AFTER_MS) {
    setConnected(false);
    if (!S.es || S.es.readyState !== EventSource.CONNECTING) connect();
  }
}, 1000);

// ---- static setup from info --------------------------------------------------------------------

function setupInfo(info) {
  S.info = info;
  setText('plant-name', info.plant + ' - ' + info.description + ' - tuning ' + info.tuning + ' - ' + info.io);
  const banner = $('hw-banner');
  if (info.hardware) {
    banner.textContent = 'CONNECTED TO HARDWARE OVER MODBUS (' + info.io + '): commands are written to real equipment. Every write asks for confirmation.';
    banner.hidden = false;
  } else {
    banner.hidden = true;
  }
  // on hardware there is no plant to act on and the firmware scans in real time
  const hw = !!info.hardware;
  document.querySelectorAll('.instructor input, .instructor select, .instructor button, #speed-select, #pause')
    .forEach((e) => { e.disabled = hw; });
  $('instructor-hw').hidden = !hw;
  const sp = $('sp-input');
  sp.min = info.setpoint_min_mm; sp.max = info.setpoint_max_mm;
  $('demand-input').max = info.steam_demand_max_pct;
  $('ramp-to').max = info.steam_demand_max_pct;
  $('bypass-min').max = Math.floor(info.bypass_max_s / 60);
  fillSelect('bypass-tag', info.interlocks.map((t) => [t, t]));
  fillSelect('fault-target', info.transmitters.map((t) => [t.tag, t.label]));
  const clear = [['all', 'all faults']].concat(info.transmitters.map((t) => [t.tag, t.label]))
    .concat(info.trippable.map((t) => [t, t.replace(/_/g, ' ')]))
    .concat([['feed_valve', 'feed valve'], ['steam', 'steam surge'], ['drum', 'tube leak']]);
  fillSelect('clear-target', clear);
  const tb = $('trip-buttons');
  tb.querySelectorAll('button').forEach((b) => b.remove());
  for (const t of info.trippable) {
    const b = document.createElement('button');
    b.type = 'button'; b.id = 'trip-' + t; b.textContent = 'Trip ' + t.replace(/_/g, ' ');
    b.addEventListener('click', () => send({ cmd: 'trip', target: t }));
    tb.appendChild(b);
  }
  updateFaultUnits();
  drawGaugeLines();
  buildAlarmRows();
}

function fillSelect(id, pairs) {
  const s = $(id);
  s.textContent = '';
  for (const [value, label] of pairs) {
    const o = document.createElement('option');
    o.value = value; o.textContent = label;
    s.appendChild(o);
  }
}

// engineering units offered per SI unit of the transmitter's value
const UNITS = { 'Pa': ['kPa', 'mbar', 'Pa', 'bar', 'mmH2O'], 'kg/s': ['t/h', 'kg/s'], 'K': ['K'], '1': ['%'] };
function updateFaultUnits() {
  const tx = S.info.transmitters.find((t) => t.tag === $('fault-target').value);
  const kind = $('fault-kind').value;
  let units = UNITS[tx ? tx.si : 'Pa'] || [tx.si];
  if (kind === 'drift') units = units.map((u) => u + '/s');
  fillSelect('fault-unit', units.map((u) => [u, u]));
  const needsValue = kind === 'drift' || kind === 'bias' || kind === 'noise-burst';
  document.querySelectorAll('#fault-form .fv').forEach((e) => { e.hidden = !needsValue; });
  document.querySelectorAll('#fault-form .fd').forEach((e) => { e.hidden = kind !== 'noise-burst'; });
}

// ---- drum gauge ------------------------------------------------------------------------------

const GAUGE = { top: 40, height: 150, x: 672, w: 22 };
function gaugeY(mm) {
  const i = S.info;
  const f = (mm - i.gauge_min_mm) / (i.gauge_max_mm - i.gauge_min_mm);
  return GAUGE.top + GAUGE.height * (1 - Math.max(0, Math.min(1, f)));
}
function drawGaugeLines() {
  const g = $('gauge-lines');
  g.textContent = '';
  const ns = 'http://www.w3.org/2000/svg';
  const lines = [{ tag: 'NWL', mm: 0, nwl: true }].concat(S.info.lines);
  for (const l of lines) {
    const y = gaugeY(l.mm);
    const ln = document.createElementNS(ns, 'line');
    ln.setAttribute('x1', GAUGE.x - 6); ln.setAttribute('x2', GAUGE.x + GAUGE.w + 6);
    ln.setAttribute('y1', y); ln.setAttribute('y2', y);
    ln.setAttribute('class', 'gline ' + (l.nwl ? 'nwl' : (l.trip ? 'trip' : 'alarm')));
    ln.id = 'gline-' + l.tag;
    g.appendChild(ln);
    const tx = document.createElementNS(ns, 'text');
    tx.setAttribute('x', GAUGE.x + GAUGE.w + 8); tx.setAttribute('y', y + 3);
    tx.setAttribute('class', 'gtext');
    tx.textContent = l.tag + ' ' + Math.round(l.mm);
    g.appendChild(tx);
  }
}

// ---- alarm list --------------------------------------------------------------------------------

function buildAlarmRows() {
  const body = $('alarm-rows');
  body.textContent = '';
  for (const tag of S.info.interlocks) {
    const tr = document.createElement('tr');
    tr.id = 'alarm-row-' + tag;
    tr.innerHTML = '<td class="tag"></td><td class="type"></td><td class="state"></td><td class="ack"></td><td class="byp"></td><td><button type="button">Ack</button></td>';
    tr.querySelector('.tag').textContent = tag;
    const b = tr.querySelector('button');
    b.id = 'ack-' + tag;
    b.addEventListener('click', () => send({ cmd: 'ack', tag: tag }));
    body.appendChild(tr);
  }
}

function renderAlarms(v) {
  for (const a of v.interlocks) {
    const tr = $('alarm-row-' + a.tag);
    if (!tr) continue;
    // a bypassed function neither annunciates nor acts; its condition is still shown
    const on = (a.active && !a.bypassed) || a.latched;
    const state = a.active ? (a.trip ? 'TRIPPED' : 'ACTIVE') : (a.latched ? 'LATCHED' : 'normal');
    tr.className = (on ? (a.trip ? 'st-trip' : 'st-alarm') : 'st-normal') + (a.acked ? '' : ' unacked');
    tr.querySelector('.type').textContent = a.trip ? 'trip' : 'alarm';
    tr.querySelector('.state').textContent = state;
    tr.querySelector('.ack').textContent = a.acked ? '' : 'UNACK';
    const byp = tr.querySelector('.byp');
    byp.textContent = a.bypassed ? ('BYPASSED' + (a.bypass_left_s !== null ? ' ' + Math.ceil(a.bypass_left_s) + ' s' : '')) : '';
    byp.className = 'byp' + (a.bypassed ? ' on' : '');
    tr.querySelector('button').disabled = a.acked;
    const gl = $('gline-' + a.tag);
    if (gl) gl.classList.toggle('active', on);
  }
  const fo = $('first-out');
  fo.textContent = v.first_out || 'none';
  fo.className = v.first_out ? 'set' : '';
}

// ---- values --------------------------------------------------------------------------------------

// flows shown: the plant's on a simulator, the firmware's measurements on hardware (no plant there)
function steamOf(v) { return S.info && S.info.hardware ? v.steam_meas_th : v.steam_th; }
function feedOf(v) { return S.info && S.info.hardware ? v.feed_meas_th : v.feed_th; }

function render(v) {
  S.values = v;
  setText('sim-time', fmt(v.t_s, 1));
  setText('speed', fmt(v.speed, v.speed < 1 ? 1 : 0));
  setText('jitter', fmt(v.jitter_p99_ms, 2));
  const sel = $('speed-select');
  if (document.activeElement !== sel && Number(sel.value) !== v.speed) {
    if (![...sel.options].some((o) => Number(o.value) === v.speed)) {
      const o = document.createElement('option');
      o.value = String(v.speed); o.textContent = v.speed + '\u00d7';
      sel.appendChild(o);
    }
    sel.value = String(v.speed);
  }
  $('pause').textContent = v.paused ? 'Resume' : 'Pause';
  $('pause').classList.toggle('on', v.paused);
  setText('dv-level', fmt(v.level_mm, 0) + ' mm');
  setText('dv-pressure', fmt(v.pressure_barg, 2) + ' barg');
  setText('dv-steam', fmt(steamOf(v), 2) + ' t/h');
  setText('dv-demand', 'demand ' + fmt(v.demand_pct, 0) + ' %');
  setText('dv-feed', fmt(feedOf(v), 2) + ' t/h');
  setText('dv-valve', fmt(v.valve_pct, 1) + ' %');
  setText('dv-valve-dem', 'demand ' + fmt(v.output_pct, 1) + ' %');
  setText('dv-feedtemp', fmt(v.feed_temp_c, 0) + ' degC');
  setText('dv-feedp', fmt(v.feed_pressure_barg, 1) + ' barg');
  setText('dv-pump-a', v.pump_a ? 'running' : 'stopped');
  setText('dv-pump-b', v.pump_b ? 'running' : 'stopped');
  $('pump-a').classList.toggle('run', v.pump_a);
  $('pump-b').classList.toggle('run', v.pump_b);
  setText('dv-burner', v.fuel_cutoff ? 'FUEL CUT OFF' : (v.burner ? 'firing' : 'off'));
  $('dv-burner').classList.toggle('abnormal', v.fuel_cutoff);
  $('burner').classList.toggle('on', v.burner);
  $('burner').classList.toggle('cut', v.fuel_cutoff);
  setText('dv-firing', 'firing ' + fmt(v.firing_pct, 0) + ' %');
  setText('dv-invalid', v.plant_invalid ? 'PLANT MODEL OUT OF RANGE' : '');
  $('dv-invalid').classList.toggle('abnormal', v.plant_invalid);
  // drum water line and gauge fill follow the indicated level
  if (S.info) {
    const y = gaugeY(v.level_mm);
    $('gauge-fill').setAttribute('y', y);
    $('gauge-fill').setAttribute('height', Math.max(0, GAUGE.top + GAUGE.height - y - 1));
    const dy = 60 + 110 * (1 - (v.level_mm - S.info.gauge_min_mm) / (S.info.gauge_max_mm - S.info.gauge_min_mm));
    const wy = Math.max(62, Math.min(168, dy));
    $('drum-water').setAttribute('y1', wy); $('drum-water').setAttribute('y2', wy);
  }
  // faceplate
  setText('fp-mode', v.mode);
  setText('fp-auto', v.auto ? 'AUTO' : 'MANUAL');
  setText('fp-pv', fmt(v.level_mm, 1));
  setText('fp-sp', fmt(v.setpoint_mm, 1));
  setText('fp-out', fmt(v.output_pct, 1));
  setText('fp-fsp', fmt(v.feed_sp_th, 2));
  $('bar-out').style.width = Math.max(0, Math.min(100, v.output_pct || 0)) + '%';
  for (const m of ['manual', 'single-element', 'three-element']) $('mode-' + m).classList.toggle('on', v.mode === m);
  $('btn-auto').classList.toggle('on', v.auto);
  $('btn-manual').classList.toggle('on', !v.auto);
  renderAlarms(v);
}

function addEvent(e) {
  const body = $('event-rows');
  const tr = document.createElement('tr');
  tr.className = 'k-' + e.kind;
  for (const t of [fmt(e.t_s, 1), e.tag, e.kind, e.message]) {
    const td = document.createElement('td');
    td.textContent = t;
    tr.appendChild(td);
  }
  body.insertBefore(tr, body.firstChild);
  while (body.childNodes.length > 300) body.removeChild(body.lastChild);
}

// ---- commands --------------------------------------------------------------------------------

async function send(cmd) {
  const msg = $('cmd-msg');
  if (S.info && S.info.hardware) {
    if (!window.confirm('Hardware is connected over Modbus. Send this command?\n' + JSON.stringify(cmd))) {
      msg.textContent = 'Not sent.';
      msg.className = 'msg';
      return;
    }
  }
  try {
    const r = await fetch('api/command', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(cmd) });
    const j = await r.json();
    msg.textContent = r.ok ? ('Queued: ' + (j.statement || cmd.cmd)) : ('Refused: ' + j.error);
    msg.className = 'msg' + (r.ok ? '' : ' err');
  } catch (err) {
    msg.textContent = 'Not sent: no connection to the bench.';
    msg.className = 'msg err';
  }
}

function num(id) { const v = $(id).value; return v === '' ? NaN : Number(v); }
function onSubmit(id, fn) { $(id).addEventListener('submit', (ev) => { ev.preventDefault(); fn(); }); }

function wire() {
  for (const m of ['manual', 'single-element', 'three-element']) {
    $('mode-' + m).addEventListener('click', () => send({ cmd: 'mode', mode: m }));
  }
  $('btn-auto').addEventListener('click', () => send({ cmd: 'auto', auto: true }));
  $('btn-manual').addEventListener('click', () => send({ cmd: 'auto', auto: false }));
  onSubmit('sp-form', () => send({ cmd: 'setpoint', mm: num('sp-input') }));
  onSubmit('out-form', () => send({ cmd: 'manual_output', percent: num('out-input') }));
  $('ack-all').addEventListener('click', () => send({ cmd: 'ack', tag: 'all' }));
  $('reset').addEventListener('click', () => send({ cmd: 'reset' }));
  onSubmit('bypass-form', () => {
    const reason = $('bypass-reason').value.trim();
    if (!reason) { $('cmd-msg').textContent = 'Refused: a bypass needs a reason.'; $('cmd-msg').className = 'msg err'; return; }
    send({ cmd: 'bypass', tag: $('bypass-tag').value, reason: reason, seconds: num('bypass-min') * 60 });
  });
  onSubmit('demand-form', () => send({ cmd: 'steam_demand', percent: num('demand-input') }));
  onSubmit('ramp-form', () => send({ cmd: 'steam_ramp', percent: num('ramp-to'), seconds: num('ramp-s') }));
  $('fault-target').addEventListener('change', updateFaultUnits);
  $('fault-kind').addEventListener('change', updateFaultUnits);
  onSubmit('fault-form', () => {
    const kind = $('fault-kind').value;
    const c = { cmd: 'fault', target: $('fault-target').value, kind: kind };
    if (kind === 'drift' || kind === 'bias' || kind === 'noise-burst') { c.value = num('fault-value'); c.unit = $('fault-unit').value; }
    if (kind === 'noise-burst') c.seconds = num('fault-s');
    send(c);
  });
  $('valve-stuck').addEventListener('click', () => send({ cmd: 'valve_stuck' }));
  onSubmit('surge-form', () => send({ cmd: 'steam_surge', percent: num('surge-input') }));
  onSubmit('leak-form', () => send({ cmd: 'tube_leak', value: num('leak-input'), unit: 't/h' }));
  onSubmit('clear-form', () => send({ cmd: 'clear', target: $('clear-target').value }));
  $('pause').addEventListener('click', () => send({ cmd: S.values && S.values.paused ? 'resume' : 'pause' }));
  $('speed-select').addEventListener('change', () => send({ cmd: 'speed', speed: Number($('speed-select').value) }));
  // trends
  document.querySelectorAll('[data-window]').forEach((b) => b.addEventListener('click', () => {
    S.view.windowS = Number(b.dataset.window);
    S.view.zoom = null;
    document.querySelectorAll('[data-window]').forEach((o) => o.classList.toggle('on', o === b));
    S.dirty = true;
  }));
  $('trend-live').addEventListener('click', () => { S.view.zoom = null; S.dirty = true; });
  const cv = $('trend');
  cv.addEventListener('mousedown', (ev) => { S.view.drag = { x0: ev.offsetX, x1: ev.offsetX }; });
  cv.addEventListener('mousemove', (ev) => { if (S.view.drag) { S.view.drag.x1 = ev.offsetX; S.dirty = true; } });
  window.addEventListener('mouseup', () => {
    const d = S.view.drag;
    S.view.drag = null;
    if (!d) return;
    if (Math.abs(d.x1 - d.x0) > 5) {
      const r = currentRange();
      const a = xToT(Math.min(d.x0, d.x1), r), b = xToT(Math.max(d.x0, d.x1), r);
      S.view.zoom = [a, b];
    }
    S.dirty = true;
  });
}

// ---- trends (canvas, own code) ------------------------------------------------------------------

const PAD = { l: 56, r: 12, t: 8, b: 22 };
function currentRange() {
  if (S.view.zoom) return S.view.zoom;
  const end = S.history.length ? S.history[S.history.length - 1][0] : 0;
  return [end - S.view.windowS, end];
}
function xToT(x, r) {
  const cv = $('trend');
  const w = cv.clientWidth - PAD.l - PAD.r;
  return r[0] + (r[1] - r[0]) * Math.max(0, Math.min(1, (x - PAD.l) / w));
}

function drawTrends() {
  if (!S.dirty || !S.info) return;
  S.dirty = false;
  const cv = $('trend');
  const dpr = window.devicePixelRatio || 1;
  const W = cv.clientWidth, H = cv.clientHeight;
  if (cv.width !== Math.round(W * dpr) || cv.height !== Math.round(H * dpr)) { cv.width = Math.round(W * dpr); cv.height = Math.round(H * dpr); }
  const g = cv.getContext('2d');
  g.setTransform(dpr, 0, 0, dpr, 0, 0);
  g.clearRect(0, 0, W, H);
  const r = currentRange();
  setText('trend-range', S.view.zoom ? ('zoomed ' + fmt(r[0], 0) + ' to ' + fmt(r[1], 0) + ' s') : '');
  const i = S.info;
  const panes = [
    { name: 'level [mm]', lo: i.gauge_min_mm, hi: i.gauge_max_mm, series: [[1, '#1f1f1f', []], [7, '#777', [6, 3]]], lines: i.lines },
    { name: 'flow [t/h]', lo: 0, hi: Math.max(1, i.steam_rated_th * 1.3), series: [[3, '#1f1f1f', []], [4, '#777', [6, 3]]] },
    { name: 'valve [%]', lo: 0, hi: 100, series: [[5, '#3c4f63', []]] },
    { name: 'pressure [barg]', lo: 0, hi: Math.max(1, i.pressure_max_barg), series: [[6, '#5e4b3c', []]] }
  ];
  const ph = (H - PAD.t - PAD.b) / panes.length;
  const x0 = PAD.l, w = W - PAD.l - PAD.r;
  const tx = (t) => x0 + w * (t - r[0]) / (r[1] - r[0]);
  g.font = '11px "DejaVu Sans", Arial, sans-serif';
  panes.forEach((p, k) => {
    const top = PAD.t + k * ph, h = ph - 8;
    const ty = (v) => top + h * (1 - (v - p.lo) / (p.hi - p.lo));
    g.strokeStyle = '#a9a9a4'; g.lineWidth = 1; g.setLineDash([]);
    g.strokeRect(x0, top, w, h);
    g.fillStyle = '#5e5e5a';
    g.fillText(p.name, x0 + 4, top + 12);
    g.textAlign = 'right';
    g.fillText(String(Math.round(p.hi)), x0 - 4, top + 9);
    g.fillText(String(Math.round(p.lo)), x0 - 4, top + h);
    g.textAlign = 'left';
    for (const l of (p.lines || [])) {
      g.strokeStyle = l.trip ? '#555' : '#999'; g.setLineDash(l.trip ? [] : [2, 3]);
      g.beginPath(); g.moveTo(x0, ty(l.mm)); g.lineTo(x0 + w, ty(l.mm)); g.stroke();
      g.fillStyle = '#5e5e5a'; g.fillText(l.tag, x0 + w - 38, ty(l.mm) - 2);
    }
    g.save();
    g.beginPath(); g.rect(x0, top, w, h); g.clip();
    for (const [col, colour, dash] of p.series) {
      g.strokeStyle = colour; g.lineWidth = 1.5; g.setLineDash(dash);
      g.beginPath();
      let started = false;
      for (const pt of S.history) {
        if (pt[0] < r[0] - 5 || pt[0] > r[1] + 5 || pt[col] === null) { started = false; continue; }
        const X = tx(pt[0]), Y = ty(pt[col]);
        if (started) g.lineTo(X, Y); else { g.moveTo(X, Y); started = true; }
      }
      g.stroke();
    }
    g.restore();
  });
  // time axis
  g.setLineDash([]); g.fillStyle = '#5e5e5a'; g.textAlign = 'center';
  const span = r[1] - r[0];
  const step = [10, 30, 60, 120, 300, 600, 1200].find((s) => span / s <= 8) || 1800;
  for (let t = Math.ceil(r[0] / step) * step; t <= r[1]; t += step) {
    if (t < 0) continue;
    g.fillText(String(t) + ' s', tx(t), H - 6);
  }
  g.textAlign = 'left';
  const d = S.view.drag;
  if (d) { g.fillStyle = 'rgba(60,60,60,0.15)'; g.fillRect(Math.min(d.x0, d.x1), PAD.t, Math.abs(d.x1 - d.x0), H - PAD.t - PAD.b); }
}

function frame() { drawTrends(); requestAnimationFrame(frame); }
window.addEventListener('resize', () => { S.dirty = true; });

wire();
loadState().catch(() => {}).finally(() => { connect(); requestAnimationFrame(frame); });

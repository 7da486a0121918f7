// Demo illustrations for the invented teardowns: drawn as SVG here (enclosures, boards with
// traces and chips carrying invented markings, cells and packs, flexible heater meanders, motors,
// LED boards) and rendered by sharp in the photos seed step. No real product is shown or copied.
import type { PartCategory } from '@splitcase/contracts';
import type { DemoDevice } from './scenario';

export const ILLUSTRATION_W = 1200;
export const ILLUSTRATION_H = 900;
/** Rendered width in pixels (drawn in 1200 × 900 units, rendered smaller to keep the seed quick). */
export const RENDER_W = 1000;

export interface IllustrationPin {
  /** Relative position 0..1 on the picture. */
  x: number;
  y: number;
  label: string;
  /** Which part to link, when the teardown has parts: first of this category whose description matches. */
  match?: { category: PartCategory; pattern?: RegExp };
}

export interface Illustration {
  layer: number;
  step: number;
  caption: string;
  svg: string;
  pins: IllustrationPin[];
}

interface Palette {
  board: string;
  trace: string;
  silk: string;
  shell: string;
  shellEdge: string;
  accent: string;
  wrap: string;
}

const PALETTES: Palette[] = [
  { board: '#22573a', trace: '#3f8a5a', silk: '#f1f1ea', shell: '#d8d4cb', shellEdge: '#a9a396', accent: '#d2691e', wrap: '#2f6fb0' },
  { board: '#1d3f6e', trace: '#3768a8', silk: '#f4f4f4', shell: '#3a3f46', shellEdge: '#24282d', accent: '#e0b43a', wrap: '#a3342b' },
  { board: '#1b1d21', trace: '#3a3e45', silk: '#e8e8e8', shell: '#f0ede6', shellEdge: '#c4bfb3', accent: '#47a4a0', wrap: '#6a3f9a' },
  { board: '#e7e4da', trace: '#c9c3b2', silk: '#2a2a2a', shell: '#7b8f6a', shellEdge: '#556447', accent: '#f08a24', wrap: '#2b8a4f' },
  { board: '#6b1f24', trace: '#9a3a40', silk: '#f6efe6', shell: '#c8d3dc', shellEdge: '#8d9ba8', accent: '#2a6fd1', wrap: '#d9a21b' },
];

/** A stable small number from the device key, so each device keeps its look between seeds. */
function hash(key: string): number {
  let h = 2166136261;
  for (const ch of key) h = Math.imul(h ^ ch.charCodeAt(0), 16777619) >>> 0;
  return h;
}

const MONO = 'font-family="DejaVu Sans Mono, Liberation Mono, monospace"';
const SANS = 'font-family="DejaVu Sans, Liberation Sans, sans-serif"';
const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
const rel = (x: number, y: number) => ({ x: +(x / ILLUSTRATION_W).toFixed(4), y: +(y / ILLUSTRATION_H).toFixed(4) });

/**
 * Cast shadows without an SVG filter (blur filters make rendering ten times slower): each
 * `<g filter="url(#shadow)">…</g>` group is drawn once in black, offset and translucent, then as it is.
 */
function lift(body: string): string {
  return body.replace(/<g filter="url\(#shadow\)">([\s\S]*?)<\/g>/g, (_m, inner: string) => `<g class="sh" transform="translate(6 9)" opacity="0.32">${inner}</g><g>${inner}</g>`);
}

/** The bench: a dark cutting mat with a 10 mm grid, a scale bar and the demo notice. */
function bench(body: string, title: string): string {
  const grid: string[] = [];
  for (let x = 0; x <= ILLUSTRATION_W; x += 40) grid.push(`<line x1="${x}" y1="0" x2="${x}" y2="${ILLUSTRATION_H}" stroke="#3b4a44" stroke-width="${x % 200 === 0 ? 1.6 : 0.7}"/>`);
  for (let y = 0; y <= ILLUSTRATION_H; y += 40) grid.push(`<line x1="0" y1="${y}" x2="${ILLUSTRATION_W}" y2="${y}" stroke="#3b4a44" stroke-width="${y % 200 === 0 ? 1.6 : 0.7}"/>`);
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${RENDER_W}" height="${Math.round((RENDER_W * ILLUSTRATION_H) / ILLUSTRATION_W)}" viewBox="0 0 ${ILLUSTRATION_W} ${ILLUSTRATION_H}">
  <defs>
    <linearGradient id="light" x1="0" y1="0" x2="1" y2="1"><stop offset="0" stop-color="#ffffff" stop-opacity="0.10"/><stop offset="1" stop-color="#000000" stop-opacity="0.18"/></linearGradient>
    <linearGradient id="cyl" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#ffffff" stop-opacity="0.28"/><stop offset="0.45" stop-color="#ffffff" stop-opacity="0.02"/><stop offset="1" stop-color="#000000" stop-opacity="0.35"/></linearGradient>
  </defs>
  <style>.sh * { fill: #000 !important; stroke: #000 !important; }</style>
  <rect width="100%" height="100%" fill="#2c3934"/>
  ${grid.join('')}
  ${lift(body)}
  <g transform="translate(40 ${ILLUSTRATION_H - 46})">
    <rect x="0" y="0" width="200" height="10" fill="#f2efe6"/><rect x="0" y="0" width="100" height="10" fill="#1e2420"/>
    <text x="0" y="30" ${SANS} font-size="16" fill="#f2efe6">0</text><text x="178" y="30" ${SANS} font-size="16" fill="#f2efe6">20 mm</text>
  </g>
  <text x="${ILLUSTRATION_W - 40}" y="${ILLUSTRATION_H - 22}" text-anchor="end" ${SANS} font-size="17" fill="#c9d2cc">${esc(title)} · demo illustration, not a photograph</text>
</svg>`;
}

function chip(x: number, y: number, w: number, h: number, marking: string[], legsPerSide: number, style: 'sop' | 'qfn' = 'sop'): string {
  const legs: string[] = [];
  if (style === 'sop') {
    const pitch = w / (legsPerSide + 1);
    for (let i = 1; i <= legsPerSide; i++) {
      legs.push(`<rect x="${x + i * pitch - 4}" y="${y - 12}" width="8" height="14" fill="#c9cdd2"/>`);
      legs.push(`<rect x="${x + i * pitch - 4}" y="${y + h - 2}" width="8" height="14" fill="#c9cdd2"/>`);
    }
  } else {
    const pitch = w / (legsPerSide + 1);
    for (let i = 1; i <= legsPerSide; i++) {
      legs.push(`<rect x="${x + i * pitch - 3}" y="${y - 5}" width="6" height="7" fill="#c9cdd2"/>`, `<rect x="${x + i * pitch - 3}" y="${y + h - 2}" width="6" height="7" fill="#c9cdd2"/>`);
      legs.push(
        `<rect x="${x - 5}" y="${y + i * (h / (legsPerSide + 1)) - 3}" width="7" height="6" fill="#c9cdd2"/>`,
        `<rect x="${x + w - 2}" y="${y + i * (h / (legsPerSide + 1)) - 3}" width="7" height="6" fill="#c9cdd2"/>`,
      );
    }
  }
  const lines = marking.map((m, i) => `<text x="${x + w / 2}" y="${y + h / 2 + (i - (marking.length - 1) / 2) * 19 + 6}" text-anchor="middle" ${MONO} font-size="15" fill="#b9bcc0">${esc(m)}</text>`);
  return `<g filter="url(#shadow)">${legs.join('')}<rect x="${x}" y="${y}" width="${w}" height="${h}" rx="3" fill="#1a1b1e"/><rect x="${x}" y="${y}" width="${w}" height="${h}" rx="3" fill="url(#light)"/></g><circle cx="${x + 10}" cy="${y + 10}" r="4" fill="#2d2f33"/>${lines.join('')}`;
}

const smd = (x: number, y: number, kind: 'r' | 'c', code: string, vertical = false) => {
  const [w, h] = vertical ? [18, 34] : [34, 18];
  const body = kind === 'r' ? '#111214' : '#b48a5a';
  const caps = vertical
    ? `<rect x="${x}" y="${y}" width="${w}" height="6" fill="#d5d8dc"/><rect x="${x}" y="${y + h - 6}" width="${w}" height="6" fill="#d5d8dc"/>`
    : `<rect x="${x}" y="${y}" width="6" height="${h}" fill="#d5d8dc"/><rect x="${x + w - 6}" y="${y}" width="6" height="${h}" fill="#d5d8dc"/>`;
  const text = kind === 'r' && !vertical ? `<text x="${x + w / 2}" y="${y + 13}" text-anchor="middle" ${MONO} font-size="10" fill="#f0f0f0">${esc(code)}</text>` : '';
  return `<rect x="${x}" y="${y}" width="${w}" height="${h}" rx="2" fill="${body}"/>${caps}${text}`;
};

const inductor = (x: number, y: number, s: number, code: string) =>
  `<g filter="url(#shadow)"><rect x="${x}" y="${y}" width="${s}" height="${s}" rx="8" fill="#34373c"/><circle cx="${x + s / 2}" cy="${y + s / 2}" r="${s * 0.34}" fill="#2a2c30" stroke="#4a4e55" stroke-width="3"/></g><text x="${x + s / 2}" y="${y + s / 2 + 7}" text-anchor="middle" ${MONO} font-size="20" fill="#c8cbd0">${esc(code)}</text>`;

const usbC = (x: number, y: number) =>
  `<g filter="url(#shadow)"><rect x="${x}" y="${y}" width="92" height="44" rx="18" fill="#c7ccd2" stroke="#8f959c" stroke-width="3"/><rect x="${x + 16}" y="${y + 15}" width="60" height="14" rx="7" fill="#2b2e33"/></g>`;
const usbA = (x: number, y: number) =>
  `<g filter="url(#shadow)"><rect x="${x}" y="${y}" width="120" height="54" rx="3" fill="#c7ccd2" stroke="#8f959c" stroke-width="3"/><rect x="${x + 12}" y="${y + 12}" width="96" height="30" fill="#20232a"/><rect x="${x + 18}" y="${y + 16}" width="84" height="10" fill="#3b6fc4"/></g>`;

const hole = (x: number, y: number) => `<circle cx="${x}" cy="${y}" r="17" fill="#c9a548"/><circle cx="${x}" cy="${y}" r="10" fill="#2c3934"/>`;
const silk = (x: number, y: number, s: string, p: Palette, size = 16) => `<text x="${x}" y="${y}" ${SANS} font-size="${size}" fill="${p.silk}" font-weight="bold">${esc(s)}</text>`;

function traces(p: Palette, paths: string[]): string {
  return paths.map((d) => `<path d="${d}" fill="none" stroke="${p.trace}" stroke-width="7" stroke-linecap="round" stroke-linejoin="round"/>`).join('');
}

/** Invented chip markings: a maker-like prefix from the device key, never a real part number. */
function markings(d: DemoDevice) {
  const h = hash(d.key);
  const pre = d.maker
    .replace(/[^A-Z]/g, '')
    .slice(0, 2)
    .padEnd(2, 'X');
  const n = (k: number) => String(((h >>> k) % 90) + 10);
  return {
    mcu: [`${pre}8F${n(3)}`, `Q${n(7)}A 26${n(11).slice(0, 1)}4`],
    power: [`${pre}P${n(5)}`, `B${n(9)}K`],
    mos: `K${n(13)}`,
    prot: [`${pre}D${n(2)}`],
    driver: [`${pre}L${n(4)}`, `C${n(6)}`],
  };
}

// ---- scenes ----------------------------------------------------------------------------------

function enclosureScene(d: DemoDevice, p: Palette): Illustration {
  const c = d.category;
  const title = `${d.maker} ${d.model} — enclosure opened`;
  let body = '';
  const pins: IllustrationPin[] = [];
  if (c === 'headlamp') {
    // Lamp housing (front and back halves) and a strip of headband.
    body = `<rect x="80" y="640" width="1040" height="70" rx="20" fill="${p.accent}" opacity="0.85"/><path d="M80 675 H1120" stroke="#00000055" stroke-width="4" stroke-dasharray="18 12"/>
      <g filter="url(#shadow)"><rect x="150" y="170" width="380" height="330" rx="70" fill="${p.shell}" stroke="${p.shellEdge}" stroke-width="6"/></g>
      <circle cx="340" cy="335" r="120" fill="#e9eef2" stroke="#9aa6b0" stroke-width="8"/><circle cx="340" cy="335" r="80" fill="#cfd9e1"/><circle cx="340" cy="335" r="34" fill="#fbfbf5" stroke="#b9c2c9" stroke-width="4"/>
      <g filter="url(#shadow)"><rect x="660" y="170" width="380" height="330" rx="70" fill="${p.shell}" stroke="${p.shellEdge}" stroke-width="6"/></g>
      <rect x="700" y="210" width="300" height="250" rx="50" fill="${p.shellEdge}" opacity="0.45"/>
      <circle cx="730" cy="240" r="16" fill="${p.shellEdge}"/><circle cx="970" cy="240" r="16" fill="${p.shellEdge}"/><circle cx="730" cy="430" r="16" fill="${p.shellEdge}"/><circle cx="970" cy="430" r="16" fill="${p.shellEdge}"/>
      <rect x="810" y="470" width="80" height="26" rx="8" fill="#26292e"/><rect x="1020" y="300" width="30" height="70" rx="8" fill="${p.accent}"/>`;
    pins.push(
      { ...rel(340, 335), label: 'Reflector and lens' },
      { ...rel(970, 430), label: 'Screw boss (Phillips 1.7 mm)', match: { category: 'fastener' } },
      { ...rel(850, 483), label: 'USB-C opening with rubber flap' },
      { ...rel(1035, 335), label: 'Mode button', match: { category: 'switch' } },
    );
  } else if (c === 'usb-fan') {
    const neck = /neck/i.test(d.model);
    body = neck
      ? `<g filter="url(#shadow)"><path d="M220 260 C220 700 980 700 980 260" fill="none" stroke="${p.shell}" stroke-width="110" stroke-linecap="round"/></g>
         <path d="M220 260 C220 700 980 700 980 260" fill="none" stroke="${p.shellEdge}" stroke-width="6" stroke-dasharray="4 10"/>
         <circle cx="220" cy="250" r="92" fill="${p.shellEdge}"/><circle cx="980" cy="250" r="92" fill="${p.shellEdge}"/>
         ${[0, 1, 2, 3, 4, 5].map((i) => `<rect x="${160 + i * 20}" y="200" width="8" height="100" fill="#1f2226"/><rect x="${920 + i * 20}" y="200" width="8" height="100" fill="#1f2226"/>`).join('')}
         <rect x="560" y="600" width="80" height="30" rx="10" fill="#26292e"/>`
      : `<g filter="url(#shadow)"><circle cx="420" cy="330" r="220" fill="${p.shell}" stroke="${p.shellEdge}" stroke-width="8"/></g>
         ${Array.from({ length: 16 }, (_, i) => {
           const a = (i * Math.PI) / 8;
           return `<line x1="${420 + Math.cos(a) * 60}" y1="${330 + Math.sin(a) * 60}" x2="${420 + Math.cos(a) * 210}" y2="${330 + Math.sin(a) * 210}" stroke="${p.shellEdge}" stroke-width="6"/>`;
         }).join('')}
         <circle cx="420" cy="330" r="150" fill="none" stroke="${p.shellEdge}" stroke-width="6"/><circle cx="420" cy="330" r="58" fill="${p.shellEdge}"/>
         <g filter="url(#shadow)"><rect x="740" y="180" width="150" height="520" rx="60" fill="${p.shell}" stroke="${p.shellEdge}" stroke-width="6"/></g>
         <rect x="770" y="220" width="90" height="420" rx="40" fill="${p.shellEdge}" opacity="0.5"/><circle cx="815" cy="300" r="26" fill="${p.accent}"/><rect x="785" y="650" width="60" height="22" rx="8" fill="#26292e"/>`;
    pins.push(
      neck ? { ...rel(220, 250), label: 'Left blower intake grille' } : { ...rel(560, 190), label: 'Front guard, snap-fit' },
      neck ? { ...rel(600, 615), label: 'USB-C charge port' } : { ...rel(815, 300), label: 'Speed button', match: { category: 'switch' } },
      neck ? { ...rel(980, 250), label: 'Right blower intake grille' } : { ...rel(815, 660), label: 'USB-C charge port' },
    );
  } else {
    const bank = c === 'power-bank';
    const w = bank ? 420 : 360;
    const h = bank ? 600 : 460;
    const half = (x: number, inside: boolean) =>
      `<g filter="url(#shadow)"><rect x="${x}" y="${450 - h / 2}" width="${w}" height="${h}" rx="${bank ? 40 : 90}" fill="${p.shell}" stroke="${p.shellEdge}" stroke-width="6"/></g>` +
      (inside
        ? `<rect x="${x + 26}" y="${450 - h / 2 + 26}" width="${w - 52}" height="${h - 52}" rx="${bank ? 26 : 70}" fill="${p.shellEdge}" opacity="0.45"/>
           <circle cx="${x + 60}" cy="${450 - h / 2 + 60}" r="15" fill="${p.shellEdge}"/><circle cx="${x + w - 60}" cy="${450 - h / 2 + 60}" r="15" fill="${p.shellEdge}"/>
           <circle cx="${x + 60}" cy="${450 + h / 2 - 60}" r="15" fill="${p.shellEdge}"/><circle cx="${x + w - 60}" cy="${450 + h / 2 - 60}" r="15" fill="${p.shellEdge}"/>
           <rect x="${x + w / 2 - 40}" y="${450 - h / 2 + 10}" width="80" height="14" rx="4" fill="${p.shellEdge}"/>`
        : bank
          ? `${[0, 1, 2, 3].map((i) => `<circle cx="${x + w / 2 - 60 + i * 40}" cy="${450 + h / 2 - 70}" r="9" fill="${i < 3 ? '#66d0ff' : '#43505a'}"/>`).join('')}`
          : `<circle cx="${x + w / 2}" cy="${450 + h / 2 - 90}" r="34" fill="${p.accent}"/>${[0, 1, 2].map((i) => `<circle cx="${x + w / 2 - 30 + i * 30}" cy="${450 + h / 2 - 150}" r="7" fill="#f6b26b"/>`).join('')}`);
    body = half(160, false) + half(660, true) + `<rect x="${660 + w / 2 - 46}" y="${450 + h / 2 - 8}" width="92" height="20" rx="8" fill="#26292e"/>`;
    pins.push(
      { ...rel(660 + w - 60, 450 + h / 2 - 60), label: 'Screw boss, self-tapping screw', match: { category: 'fastener' } },
      { ...rel(660 + w / 2, 450 - h / 2 + 17), label: 'Snap clip (moulded)', match: { category: 'enclosure' } },
      bank
        ? { ...rel(160 + w / 2 - 20, 450 + h / 2 - 70), label: 'Charge-level LEDs window', match: { category: 'led' } }
        : { ...rel(160 + w / 2, 450 + h / 2 - 90), label: 'Heat-level button', match: { category: 'switch' } },
    );
  }
  return { layer: 1, step: 1, caption: `Enclosure opened: both halves, inside faces up (demo illustration)`, svg: bench(body, title), pins };
}

function boardScene(d: DemoDevice, p: Palette): Illustration {
  const m = markings(d);
  const c = d.category;
  const title = `${d.maker} ${d.model} — main board`;
  const pins: IllustrationPin[] = [];
  let body = '';
  if (c === 'headlamp') {
    // Round LED board (aluminium core) and a small driver board.
    body = `<g filter="url(#shadow)"><circle cx="360" cy="420" r="230" fill="#c9ced3" stroke="#9ba3ab" stroke-width="6"/></g>
      <circle cx="360" cy="420" r="200" fill="#f2f2ee"/>
      ${traces({ ...p, trace: '#c9a548' }, ['M360 420 L200 300', 'M360 420 L520 300'])}
      <rect x="310" y="370" width="100" height="100" rx="8" fill="#f6f4d8" stroke="#c8c39a" stroke-width="4"/><circle cx="360" cy="420" r="34" fill="#fff8c9" stroke="#d9c96b" stroke-width="4"/>
      ${d.design.loads[0]?.count === 2 ? `<rect x="190" y="380" width="80" height="80" rx="8" fill="#f6f4d8" stroke="#c8c39a" stroke-width="4"/><circle cx="230" cy="420" r="26" fill="#fff8c9"/>` : ''}
      ${smd(420, 540, 'r', 'R10')}
      <g filter="url(#shadow)"><rect x="680" y="220" width="420" height="420" rx="16" fill="${p.board}"/></g>
      ${traces(p, ['M720 300 H900 V420', 'M760 600 V480 H1000', 'M1060 280 V560'])}
      ${chip(760, 330, 150, 110, m.driver, 4)}${inductor(960, 300, 100, '2R2')}${smd(740, 500, 'r', '103')}${smd(800, 500, 'c', '')}${smd(960, 470, 'r', '4R7')}${usbC(850, 560)}
      ${d.design.hasTemperatureSensor ? `<rect x="1000" y="520" width="40" height="22" rx="3" fill="#2e3338"/>${silk(996, 512, 'RT1', p, 13)}` : ''}
      ${silk(760, 316, 'U1', p)}${silk(960, 292, 'L1', p)}${silk(850, 548, 'J1', p)}${hole(710, 250)}${hole(1070, 610)}`;
    pins.push(
      { ...rel(360, 420), label: 'Main LED on aluminium-core board', match: { category: 'led' } },
      { ...rel(904, 336), label: `Driver IC, marked ${m.driver[0]}`, match: { category: 'ic', pattern: /driver|buck|led/i } },
      { ...rel(1054, 306), label: 'Buck inductor 2R2', match: { category: 'inductor' } },
      { ...rel(896, 582), label: 'USB-C receptacle', match: { category: 'connector' } },
    );
    if (d.design.hasTemperatureSensor) pins.push({ ...rel(1020, 531), label: 'NTC thermistor for thermal step-down', match: { category: 'sensor' } });
  } else {
    const bank = c === 'power-bank';
    const fan = c === 'usb-fan';
    const [bx, by, bw, bh] = bank ? [140, 250, 920, 380] : fan ? [280, 260, 640, 360] : [200, 220, 800, 440];
    body = `<g filter="url(#shadow)"><rect x="${bx}" y="${by}" width="${bw}" height="${bh}" rx="${fan ? 60 : 22}" fill="${p.board}"/></g>
      <rect x="${bx}" y="${by}" width="${bw}" height="${bh}" rx="${fan ? 60 : 22}" fill="url(#light)"/>
      ${traces(p, [
        `M${bx + 80} ${by + 90} H${bx + bw * 0.42} V${by + bh * 0.55}`,
        `M${bx + bw * 0.5} ${by + 70} H${bx + bw - 90} V${by + bh - 80}`,
        `M${bx + 70} ${by + bh - 70} H${bx + bw * 0.6}`,
        `M${bx + bw * 0.3} ${by + bh - 70} V${by + bh * 0.45}`,
      ])}
      ${[0, 1, 2, 3, 4, 5].map((i) => `<circle cx="${bx + 120 + (i * (bw - 240)) / 5}" cy="${by + bh * 0.5 + ((i % 2) * 2 - 1) * 30}" r="6" fill="#c9a548"/>`).join('')}
      ${hole(bx + 40, by + 40)}${hole(bx + bw - 40, by + bh - 40)}`;
    // Power IC and inductor.
    const px = bx + bw * 0.45;
    const py = by + 60;
    body += chip(px, py, 170, 120, m.power, bank ? 6 : 4, bank ? 'qfn' : 'sop') + silk(px, py - 18, 'U2', p) + inductor(px + 210, py + 4, 110, bank ? '1R0' : '4R7') + silk(px + 210, py - 10, 'L1', p);
    pins.push({
      ...rel(px + 164, py + 8),
      label: `${bank ? 'Charge and boost' : fan ? 'Linear charger' : 'Buck-boost charger / output'} IC, marked ${m.power[0]}`,
      match: { category: 'ic', pattern: /charger|boost|buck|pmic/i },
    });
    pins.push({ ...rel(px + 312, py + 12), label: `Power inductor ${bank ? '1R0' : '4R7'}`, match: { category: 'inductor' } });
    // MCU (heaters, fans) or fuel-gauge LEDs (banks).
    const mx = bx + 90;
    const my = by + bh * 0.5 - 50;
    if (!bank) {
      body += chip(mx, my, 120, 90, [m.mcu[0]!], 4) + silk(mx, my - 18, 'U1', p);
      pins.push({ ...rel(mx + 114, my + 6), label: `8-bit microcontroller, marked ${m.mcu[0]}`, match: { category: 'ic', pattern: /micro|mcu|controller/i } });
    } else {
      body +=
        [0, 1, 2, 3].map((i) => `<rect x="${mx + i * 46}" y="${my + 20}" width="28" height="18" rx="3" fill="#e8f6ff" stroke="#6fb6e2" stroke-width="3"/>`).join('') + silk(mx, my + 6, 'D1–D4', p);
      pins.push({ ...rel(mx + 80, my + 29), label: 'Charge-level LEDs D1–D4', match: { category: 'led' } });
    }
    // MOSFET for heaters and fans.
    if (!bank) {
      const qx = bx + bw * 0.3;
      const qy = by + bh - 140;
      body += `<rect x="${qx}" y="${qy}" width="60" height="44" rx="3" fill="#1a1b1e"/>${[0, 1, 2].map((i) => `<rect x="${qx + 6 + i * 20}" y="${qy + 44}" width="8" height="12" fill="#c9cdd2"/>`).join('')}<text x="${qx + 30}" y="${qy + 28}" text-anchor="middle" ${MONO} font-size="13" fill="#b9bcc0">${m.mos}</text>${silk(qx, qy - 10, 'Q1', p)}`;
      pins.push({ ...rel(qx + 58, qy + 2), label: `${fan ? 'Motor' : 'Heater'} switch MOSFET, marked ${m.mos}`, match: { category: 'semiconductor', pattern: /mosfet|transistor|fet/i } });
    }
    // Passives with codes.
    body +=
      smd(bx + bw * 0.62, by + bh - 120, 'r', '103') +
      smd(bx + bw * 0.62 + 50, by + bh - 120, 'r', '4R7') +
      smd(bx + bw * 0.62 + 100, by + bh - 120, 'c', '') +
      smd(bx + bw * 0.62 + 140, by + bh - 128, 'c', '', true);
    pins.push({ ...rel(bx + bw * 0.62 + 67, by + bh - 111), label: 'Current-sense resistor 4R7 (marking as read)', match: { category: 'passive', pattern: /sense|4R7|resistor/i } });
    // Connectors.
    if (bank) {
      body += usbA(bx + bw - 150, by + bh - 110) + usbC(bx + bw - 270, by + bh - 100) + silk(bx + bw - 150, by + bh - 120, 'J2', p) + silk(bx + bw - 270, by + bh - 110, 'J1', p);
      pins.push(
        { ...rel(bx + bw - 90, by + bh - 83), label: 'USB-A output', match: { category: 'connector', pattern: /usb-?a|output/i } },
        { ...rel(bx + bw - 224, by + bh - 78), label: 'USB-C input/output', match: { category: 'connector', pattern: /usb-?c/i } },
      );
    } else {
      body += usbC(bx + bw - 140, by + bh - 90) + silk(bx + bw - 140, by + bh - 100, 'J1', p);
      pins.push({ ...rel(bx + bw - 94, by + bh - 68), label: 'USB-C receptacle', match: { category: 'connector' } });
    }
    if (d.design.hasTemperatureSensor) {
      body += `<rect x="${bx + bw * 0.3 + 110}" y="${by + 70}" width="40" height="22" rx="3" fill="#2e3338"/>${silk(bx + bw * 0.3 + 106, by + 62, 'RT1', p, 13)}`;
      pins.push({ ...rel(bx + bw * 0.3 + 130, by + 81), label: 'NTC thermistor', match: { category: 'sensor' } });
    }
  }
  return { layer: 2, step: 1, caption: 'Main board, component side (demo illustration; chip markings invented)', svg: bench(body, title), pins };
}

function cellScene(d: DemoDevice, p: Palette): Illustration {
  const cell = d.design.cells;
  const title = `${d.maker} ${d.model} — cell${cell.parallel * cell.series > 1 ? 's' : ''}`;
  const pins: IllustrationPin[] = [];
  let body = '';
  const n = Math.max(1, cell.series * cell.parallel);
  if (cell.chemistry === 'li-po') {
    body = `<g filter="url(#shadow)"><rect x="300" y="230" width="600" height="420" rx="18" fill="#c9ccd0"/></g>
      <rect x="300" y="230" width="600" height="420" rx="18" fill="url(#light)"/><rect x="330" y="260" width="540" height="360" rx="10" fill="none" stroke="#aeb3b8" stroke-width="3"/>
      <text x="600" y="430" text-anchor="middle" ${SANS} font-size="30" fill="#5a6068">3.7 V ${Math.round(cell.ratedAh * 1000)} mAh</text>
      <text x="600" y="470" text-anchor="middle" ${MONO} font-size="20" fill="#6a7078">${esc(cell.format.toUpperCase())}</text>
      <rect x="430" y="170" width="340" height="66" rx="6" fill="${p.board}"/>${chip(560, 184, 70, 36, ['DW'], 3)}
      <rect x="470" y="140" width="40" height="40" fill="#d5d8dc"/><rect x="690" y="140" width="40" height="40" fill="#d5d8dc"/>
      <path d="M490 140 C490 90 380 90 300 110" stroke="#c43a2f" stroke-width="10" fill="none"/><path d="M710 140 C710 80 860 80 920 110" stroke="#1b1c1f" stroke-width="10" fill="none"/>`;
    pins.push({ ...rel(600, 430), label: `Pouch cell ${cell.format}, label ${Math.round(cell.ratedAh * 1000)} mAh`, match: { category: 'cell' } });
    if (cell.protection) pins.push({ ...rel(595, 202), label: 'Protection board (PCM) on the cell tabs', match: { category: 'ic', pattern: /protect/i } });
    if (d.teardown.safetyNotes.toLowerCase().includes('swollen')) pins.push({ ...rel(840, 300), label: 'Pouch slightly swollen: handled as a suspect cell' });
  } else {
    const rows = Math.min(n, 6);
    const ch = Math.min(150, Math.floor(620 / rows) - 14);
    const pitch = ch + 14;
    const top = 430 - (rows * pitch) / 2;
    const mid = ch / 2;
    for (let i = 0; i < rows; i++) {
      const y = top + i * pitch;
      body += `<g filter="url(#shadow)"><rect x="250" y="${y}" width="650" height="${ch}" rx="14" fill="${p.wrap}"/></g><rect x="250" y="${y}" width="650" height="${ch}" rx="14" fill="url(#cyl)"/>
        <rect x="900" y="${y + mid - 22}" width="16" height="44" rx="4" fill="#cfd3d8"/><rect x="236" y="${y + 6}" width="16" height="${ch - 12}" rx="4" fill="#b8bdc3"/>
        <text x="575" y="${y + mid + 9}" text-anchor="middle" ${SANS} font-size="24" fill="#ffffffcc">${esc(cell.format)} · ${cell.ratedAh.toFixed(2)} Ah</text>`;
    }
    if (cell.joining === 'welded-tab') {
      body += `<rect x="214" y="${top - 10}" width="24" height="${rows * pitch}" fill="#d9dde1" stroke="#a8aeb4" stroke-width="2"/><rect x="912" y="${top - 10}" width="24" height="${rows * pitch}" fill="#d9dde1" stroke="#a8aeb4" stroke-width="2"/>`;
      for (let i = 0; i < rows; i++)
        body += `<circle cx="226" cy="${top + i * pitch + mid - 10}" r="4" fill="#8d949b"/><circle cx="226" cy="${top + i * pitch + mid + 10}" r="4" fill="#8d949b"/><circle cx="924" cy="${top + i * pitch + mid - 10}" r="4" fill="#8d949b"/><circle cx="924" cy="${top + i * pitch + mid + 10}" r="4" fill="#8d949b"/>`;
      pins.push({ ...rel(924, top + mid), label: 'Spot-welded nickel strip', match: { category: 'wire', pattern: /nickel|strip|tab/i } });
    } else if (cell.joining === 'soldered') {
      body += `<path d="M918 ${top + mid} C1000 ${top + mid} 1000 ${top - 60} 1080 ${top - 80}" stroke="#c43a2f" stroke-width="10" fill="none"/><path d="M236 ${top + mid} C150 ${top + mid} 150 ${top - 60} 90 ${top - 80}" stroke="#1b1c1f" stroke-width="10" fill="none"/>
        <circle cx="918" cy="${top + mid}" r="16" fill="#b9bcc0"/><circle cx="236" cy="${top + mid}" r="16" fill="#b9bcc0"/>`;
      pins.push({ ...rel(918, top + mid), label: 'Lead wire soldered straight to the cell can' });
    } else if (cell.joining === 'holder') {
      body += `<rect x="200" y="${top - 20}" width="760" height="${rows * pitch + 30}" rx="12" fill="none" stroke="#1d1f22" stroke-width="14"/><path d="M940 ${top + 20} l12 8 l-12 8 l12 8 l-12 8 l12 8" stroke="#cfd3d8" stroke-width="5" fill="none"/>`;
      pins.push({ ...rel(946, top + mid), label: 'Spring contact of the cell holder', match: { category: 'connector', pattern: /holder|spring/i } });
    }
    pins.unshift({
      ...rel(575, top + mid),
      label: `${cell.format} cell${rows > 1 ? ` 1 of ${rows} (${cell.series}S${cell.parallel}P)` : ''}, label ${cell.ratedAh.toFixed(2)} Ah`,
      match: { category: 'cell' },
    });
    if (cell.protection) {
      body += `<g filter="url(#shadow)"><rect x="960" y="${450 - 60}" width="150" height="120" rx="8" fill="${p.board}"/></g>${chip(990, 450 - 30, 90, 50, [markings(d).prot[0]!], 3)}`;
      pins.push({ ...rel(1035, 450), label: 'Protection IC board', match: { category: 'ic', pattern: /protect/i } });
    }
  }
  return { layer: 3, step: 1, caption: `Cell${n > 1 ? 's' : ''} out of the case: ${cell.series}S${cell.parallel}P ${cell.format} (demo illustration)`, svg: bench(body, title), pins };
}

function heaterScene(d: DemoDevice): Illustration {
  const heater = d.design.loads.find((l) => l.kind === 'heater');
  const count = heater?.count ?? 1;
  const pins: IllustrationPin[] = [];
  let body = '';
  const w = count > 1 ? 420 : 560;
  for (let i = 0; i < count; i++) {
    const x = count > 1 ? 140 + i * 500 : 320;
    const y = 200;
    const h = 460;
    let meander = `M${x + 40} ${y + h - 30} V${y + 50}`;
    const turns = 9;
    for (let k = 0; k < turns; k++) {
      const cx = x + 40 + (k + 1) * ((w - 80) / turns);
      meander += k % 2 === 0 ? ` H${cx} V${y + h - 70}` : ` H${cx} V${y + 50}`;
    }
    meander += ` H${x + w - 40} V${y + h - 30}`;
    body += `<g filter="url(#shadow)"><rect x="${x}" y="${y}" width="${w}" height="${h}" rx="26" fill="#c98a2b"/></g><rect x="${x}" y="${y}" width="${w}" height="${h}" rx="26" fill="url(#light)"/>
      <path d="${meander}" fill="none" stroke="#d9b07a" stroke-width="14" stroke-linejoin="round"/><path d="${meander}" fill="none" stroke="#b3672a" stroke-width="6" stroke-linejoin="round"/>
      <rect x="${x + w / 2 - 70}" y="${y + h - 4}" width="140" height="70" rx="6" fill="#c98a2b"/><rect x="${x + w / 2 - 50}" y="${y + h + 30}" width="30" height="30" fill="#e0c28a"/><rect x="${x + w / 2 + 20}" y="${y + h + 30}" width="30" height="30" fill="#e0c28a"/>
      ${d.design.hasTemperatureSensor ? `<rect x="${x + w - 110}" y="${y + 20}" width="46" height="24" rx="3" fill="#2e3338"/>` : ''}`;
    pins.push({
      ...rel(x + w / 2, y + h / 2),
      label: `Flexible heater element ${count > 1 ? (i === 0 ? 'A (front)' : 'B (back)') : ''}, about ${heater?.ohms ?? '?'} Ω`.replace(' ,', ','),
      match: { category: 'heater' },
    });
    if (d.design.hasTemperatureSensor) pins.push({ ...rel(x + w - 87, y + 32), label: 'NTC on the heater flex', match: { category: 'sensor' } });
  }
  pins.push({ ...rel(count > 1 ? 140 + w / 2 - 35 : 320 + w / 2 - 35, 705), label: 'Solder pads (heater leads)' });
  const caption = `Heater element${count > 1 ? `s (${count}, wired in ${heater?.connection})` : ''}: copper meander on polyimide (demo illustration)`;
  return { layer: 3, step: 2, caption, svg: bench(body, `${d.maker} ${d.model} — heater flex`), pins };
}

function motorScene(d: DemoDevice, p: Palette): Illustration {
  const motor = d.design.loads.find((l) => l.kind === 'motor');
  const count = motor?.count ?? 1;
  const brushless = /brushless/i.test(motor?.label ?? '');
  let body = '';
  const pins: IllustrationPin[] = [];
  for (let i = 0; i < count; i++) {
    const cx = count > 1 ? 330 + i * 540 : 560;
    body += `<g filter="url(#shadow)"><circle cx="${cx}" cy="420" r="200" fill="${p.shell}" stroke="${p.shellEdge}" stroke-width="6"/></g>
      ${Array.from({ length: brushless ? 11 : 5 }, (_, k) => {
        const a = (k * 2 * Math.PI) / (brushless ? 11 : 5);
        return `<path d="M${cx} 420 Q${cx + Math.cos(a + 0.5) * 140} ${420 + Math.sin(a + 0.5) * 140} ${cx + Math.cos(a) * 185} ${420 + Math.sin(a) * 185}" stroke="${p.accent}" stroke-width="${brushless ? 16 : 40}" fill="none" stroke-linecap="round" opacity="0.9"/>`;
      }).join('')}
      <circle cx="${cx}" cy="420" r="62" fill="#9aa1a8" stroke="#6d747b" stroke-width="5"/><circle cx="${cx}" cy="420" r="14" fill="#3a3f45"/>`;
    pins.push({ ...rel(cx, 420), label: `${brushless ? 'Brushless blower' : 'Brushed DC motor'}${count > 1 ? (i === 0 ? ' (left)' : ' (right)') : ''}`, match: { category: 'motor' } });
  }
  body += `<path d="M${count > 1 ? 330 : 560} 620 C${count > 1 ? 330 : 560} 720 760 760 900 700" stroke="#c43a2f" stroke-width="8" fill="none"/><path d="M${count > 1 ? 350 : 580} 620 C${count > 1 ? 350 : 580} 700 760 740 900 720" stroke="#1b1c1f" stroke-width="8" fill="none"/>`;
  return {
    layer: 3,
    step: 2,
    caption: `${brushless ? 'Blower' : 'Fan'} motor${count > 1 ? 's' : ''} with the impeller on (demo illustration)`,
    svg: bench(body, `${d.maker} ${d.model} — motor`),
    pins,
  };
}

/** 3–4 illustrations per device: enclosure, board, cells, plus the heater flex or the motor. */
export function illustrationsFor(d: DemoDevice): Illustration[] {
  const p = PALETTES[hash(d.key) % PALETTES.length]!;
  const list = [enclosureScene(d, p), boardScene(d, p), cellScene(d, p)];
  if (d.design.loads.some((l) => l.kind === 'heater')) list.push(heaterScene(d));
  if (d.design.loads.some((l) => l.kind === 'motor')) list.push(motorScene(d, p));
  return list;
}

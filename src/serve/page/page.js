// zfactor bench: the page's script. Every number comes from the server's /api/, which runs
// the command line's own commands; this script only asks, converts SI to the units the user
// typed, and draws.
"use strict";

(function () {
  const $ = (id) => document.getElementById(id);

  // Pressure units of the form: factor to Pa, and whether the reading is gauge.
  const PRESSURE = {
    bar: [1e5, false], barg: [1e5, true], MPa: [1e6, false], kPa: [1e3, false],
    psia: [6894.757293168, false], psig: [6894.757293168, true], atm: [101325, false],
  };
  // Temperature units: from kelvin.
  const TEMPERATURE = {
    K: (t) => t, degC: (t) => t - 273.15, degF: (t) => t * 1.8 - 459.67, R: (t) => t * 1.8,
  };
  // Line styles that stay apart in black and white: a dash pattern and a colour each.
  const STYLES = [
    ["#0b5394", []], ["#b45f06", [8, 4]], ["#38761d", [2, 3]], ["#741b47", [12, 4, 2, 4]],
    ["#134f5c", [4, 4]], ["#7f6000", [1, 3]], ["#990000", [16, 6]], ["#20124d", [6, 2, 2, 2]],
  ];

  let about = null;
  let catalogue = [];
  let shown = null; // what the page shows, for the downloads

  async function call(path, body) {
    const init = body === undefined ? {} : {
      method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify(body),
    };
    const r = await fetch(path, init);
    const data = await r.json();
    if (!r.ok) {
      const e = new Error(data.error || r.statusText);
      e.status = r.status;
      throw e;
    }
    return data;
  }

  function setStatus(text, failed) {
    const s = $("status");
    s.textContent = text;
    s.className = failed ? "status failed" : "status";
  }

  // --- the form -----------------------------------------------------------------------------

  const DEFAULT_MODELS = ["pr", "srk", "lk"];

  function fillModels() {
    const box = $("models");
    $("models-loading").remove();
    for (const m of catalogue) {
      const row = document.createElement("div");
      row.className = "model-choice";
      const input = document.createElement("input");
      input.type = "checkbox";
      input.id = "model-" + m.id;
      input.value = m.id;
      input.checked = DEFAULT_MODELS.includes(m.id);
      const label = document.createElement("label");
      label.htmlFor = input.id;
      label.innerHTML = "<code></code> <span></span>";
      label.querySelector("code").textContent = m.id;
      label.querySelector("span").textContent = m.name;
      label.style.display = "contents";
      row.append(input, label);
      box.append(row);
    }
  }

  function chosenModels() {
    return [...document.querySelectorAll("#models input:checked")].map((i) => i.value);
  }

  // The fluid options of a request: a mixture when the text has name=fraction pairs.
  function gasOptions() {
    const text = $("gas").value.trim();
    return text.includes("=") ? { mix: text } : { fluid: text };
  }

  // --- units --------------------------------------------------------------------------------

  function pressureIn(unit, pa, ambient) {
    const [factor, gauge] = PRESSURE[unit];
    return (gauge ? pa - ambient : pa) / factor;
  }

  function temperatureIn(unit, k) {
    return TEMPERATURE[unit](k);
  }

  function fixed(x, digits) {
    if (x === null || x === undefined || !Number.isFinite(x)) return "";
    const v = Number(x.toFixed(digits));
    return (Object.is(v, -0) ? 0 : v).toFixed(digits);
  }

  function significant(x, n) {
    if (x === null || x === undefined || !Number.isFinite(x)) return "";
    if (x === 0) return "0";
    const digits = Math.max(0, n - 1 - Math.floor(Math.log10(Math.abs(x))));
    return fixed(x, digits);
  }

  // --- asking -------------------------------------------------------------------------------

  async function run(event) {
    event.preventDefault();
    const models = chosenModels();
    if (models.length === 0) {
      setStatus("Choose at least one model.", true);
      return;
    }
    const gas = gasOptions();
    const tUnit = $("t-unit").value;
    const pUnit = $("p-unit").value;
    const t = `${$("t-value").value.trim()} ${tUnit}`;
    const p = `${$("p-value").value.trim()} ${pUnit}`;
    const compared = models.filter((m) => m !== "reference");
    setStatus("Computing\u2026", false);
    $("run").disabled = true;
    try {
      const at = await call("/api/compare", {
        ...gas, temperatures: t, pressures: p, model: (compared.length ? compared : models).join(","),
      });
      const ref = at.reference && at.reference.kind === "model" ? at.reference.id : null;
      const stateModels = ref && !models.includes(ref) ? [...models, ref] : models;
      const state = await call("/api/state", {
        ...gas, temperature: t, pressure: p, model: stateModels.join(","),
      });
      const ambient = state.input.ambient_pressure_pa;
      const pa = state.input.pressure_pa;
      const top = Math.max(2 * pa, 10e5);
      const bottom = Math.min(1e5, pa / 2);
      const range = `${pressureIn(pUnit, bottom, ambient)}..${pressureIn(pUnit, top, ambient)} ${pUnit} n 200`;
      const isoModels = [...new Set([...(compared.length ? compared : models), "ideal"])];
      const iso = await call("/api/compare", {
        ...gas, temperatures: t, pressures: range, model: isoModels.join(","),
      });
      let env = null;
      let envError = null;
      try {
        const pure = state.composition.length === 1;
        const envModel = pure && ref ? ref : (["pr", "srk", "pr78"].find((m) => models.includes(m)) || "pr");
        env = await call("/api/envelope", { ...gas, model: envModel });
      } catch (e) {
        envError = e.message;
      }
      show({ state, at, iso, env, envError, ref, tUnit, pUnit, ambient, t, p });
      setStatus(`Done: ${state.results.length} models at ${t}, ${p}.`, false);
    } catch (e) {
      setStatus(e.message, true);
    } finally {
      $("run").disabled = false;
    }
  }

  // --- showing ------------------------------------------------------------------------------

  function show(s) {
    $("answers").hidden = false;
    const rows = sideBySide(s);
    isotherm(s);
    envelope(s);
    notes(s);
    shown = { s, rows };
  }

  const COLUMNS = [
    ["model", "Model"],
    ["z", "Z"],
    ["density", "Density (kg/m\u00b3)"],
    ["deviation", "Density vs ref. (%)"],
    ["h", "h (kJ/kg)"],
    ["s", "s (kJ/(kg K))"],
    ["cp", "cp (kJ/(kg K))"],
    ["w", "w, sound (m/s)"],
    ["phase", "Phase"],
    ["range", "Range"],
  ];

  function sideBySide(s) {
    const devs = {};
    const point = s.at.points[0];
    if (point) for (const v of point.values) devs[v.model] = v.deviation_pct;
    $("side-lead").textContent =
      `${s.state.fluid} at ${s.t} (${fixed(s.state.input.temperature_k, 2)} K) and ${s.p}` +
      ` (${significant(s.state.input.pressure_pa / 1e5, 6)} bar absolute).`;
    const table = $("side");
    table.replaceChildren();
    const head = table.createTHead().insertRow();
    for (const [, label] of COLUMNS) {
      const th = document.createElement("th");
      th.textContent = label;
      th.scope = "col";
      head.append(th);
    }
    const body = table.createTBody();
    const rows = [];
    for (const r of s.state.results) {
      const perKg = r.molar_density_mol_m3 / r.mass_density_kg_m3; // mol/kg
      const isRef = r.model === s.ref;
      const flagged = r.warnings.length > 0;
      const values = {
        model: r.model,
        z: r.z,
        density: r.mass_density_kg_m3,
        deviation: isRef ? null : devs[r.model] ?? null,
        h: r.enthalpy_j_kg === null ? null : r.enthalpy_j_kg / 1e3,
        s: r.entropy_j_kg_k === null ? null : r.entropy_j_kg_k / 1e3,
        cp: r.cp_j_mol_k === null ? null : (r.cp_j_mol_k * perKg) / 1e3,
        w: r.speed_of_sound_m_s,
        phase: r.phase,
        range: flagged ? r.warnings.join("; ") : "in range",
      };
      const text = {
        model: r.model,
        z: fixed(values.z, 5),
        density: significant(values.density, 5),
        deviation: isRef ? "reference" : values.deviation === null ? "\u2014" : fixed(values.deviation, 2),
        h: fixed(values.h, 2),
        s: fixed(values.s, 4),
        cp: fixed(values.cp, 4),
        w: fixed(values.w, 1),
        phase: r.phase,
        range: values.range,
      };
      const tr = body.insertRow();
      tr.dataset.model = r.model;
      tr.title = r.model_name;
      if (isRef) tr.className = "reference";
      for (const [key] of COLUMNS) {
        const td = tr.insertCell();
        td.textContent = text[key];
        td.dataset.key = key;
        if (typeof values[key] === "number") td.dataset.value = String(values[key]);
        if (key === "range") td.className = "range";
        else if (flagged && key !== "model" && key !== "phase") td.classList.add("flagged");
      }
      rows.push(values);
    }
    const key = $("side-key");
    key.replaceChildren();
    for (const r of s.state.results) {
      const li = document.createElement("li");
      li.innerHTML = "<code></code> ";
      li.querySelector("code").textContent = r.model;
      li.append(`${r.model_name}: ${r.citation}`);
      key.append(li);
    }
    $("side-foot").textContent = s.ref
      ? `Reference: ${s.at.reference.citation}. \u2691 marks values outside the model's range.`
      : "No reference formulation for this fluid: compare the models with each other. " +
        "\u2691 marks values outside the model's range.";
    return rows;
  }

  function isotherm(s) {
    const box = $("isotherm");
    box.replaceChildren();
    const points = s.iso.points;
    const xs = points.map((p) => pressureIn(s.pUnit, p.pressure_pa, s.ambient));
    const ids = s.iso.models.map((m) => m.model);
    const data = [xs];
    const series = [{ label: `P (${s.pUnit})` }];
    const labels = [];
    const hasRef = points.some((p) => p.reference_z !== null && p.reference_z !== undefined);
    if (hasRef) {
      data.push(points.map((p) => p.reference_z ?? null));
      const named = s.state.results.find((r) => r.model === s.ref);
      series.push({ label: named ? named.model_name : "reference", stroke: "#000", width: 3 });
      labels.push("reference");
    }
    ids.forEach((id, k) => {
      data.push(points.map((p) => {
        const v = p.values.find((x) => x.model === id);
        return v && v.z !== null && v.error === null ? v.z : null;
      }));
      if (id === "ideal") {
        series.push({ label: "ideal gas", stroke: "#777", width: 1.5, dash: [3, 5] });
      } else {
        const [color, dash] = STYLES[k % STYLES.length];
        series.push({ label: id, stroke: color, width: 2, dash });
      }
      labels.push(id);
    });
    box.dataset.series = JSON.stringify(labels);
    const width = Math.max(320, box.clientWidth || 640);
    const chart = new uPlot({
      width, height: 360,
      scales: { x: { time: false } },
      axes: [
        { label: `Pressure (${s.pUnit})` },
        { label: "Z", values: (u, v) => v.map((x) => fixed(x, 3)) },
      ],
      series,
      cursor: { drag: { x: true, y: true } },
      hooks: {
        // The pressure asked for: a dotted vertical line across the plot.
        draw: [(u) => {
          const at = pressureIn(s.pUnit, s.state.input.pressure_pa, s.ambient);
          const x = u.valToPos(at, "x", true);
          if (!Number.isFinite(x) || x < u.bbox.left || x > u.bbox.left + u.bbox.width) return;
          const ctx = u.ctx;
          ctx.save();
          ctx.setLineDash([2, 4]);
          ctx.strokeStyle = "#1b2027";
          ctx.lineWidth = 1.5;
          ctx.beginPath();
          ctx.moveTo(x, u.bbox.top);
          ctx.lineTo(x, u.bbox.top + u.bbox.height);
          ctx.stroke();
          ctx.restore();
        }],
      },
    }, data, box);
    // The state asked for, marked on the chart's pressure axis in the legend's title.
    box.setAttribute("aria-label", `Z against pressure at ${s.t}; ${labels.length} curves`);
    return chart;
  }

  // --- the envelope, drawn as SVG (its curve turns back on itself, so it is not a function
  // of one axis as uPlot's lines are) ---------------------------------------------------------

  function ticks(lo, hi, n) {
    const step0 = (hi - lo) / n;
    const mag = 10 ** Math.floor(Math.log10(step0));
    const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= step0) || mag * 10;
    const out = [];
    for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) out.push(v);
    return out;
  }

  function svgElement(name, attrs, text) {
    const e = document.createElementNS("http://www.w3.org/2000/svg", name);
    for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, v);
    if (text !== undefined) e.textContent = text;
    return e;
  }

  function envelope(s) {
    const box = $("envelope");
    box.replaceChildren();
    if (!s.env) {
      $("env-lead").textContent = `No envelope: ${s.envError}`;
      return;
    }
    const pure = s.env.kind === "pure";
    $("env-title").textContent = pure ? "Vapour-pressure curve" : "Phase envelope";
    $("env-lead").textContent = `${s.env.model_name}; the state asked for is the cross.`;
    const T = (k) => temperatureIn(s.tUnit, k);
    const P = (pa) => pressureIn(s.pUnit, pa, s.ambient);
    const branches = {};
    for (const p of s.env.points) (branches[p.branch] ||= []).push([T(p.temperature_k), P(p.pressure_pa)]);
    const marks = [
      ["critical point", s.env.critical_point, "circle"],
      ["cricondenbar", s.env.cricondenbar, "up"],
      ["cricondentherm", s.env.cricondentherm, "square"],
    ].filter(([, at]) => at);
    const state = [T(s.state.input.temperature_k), P(s.state.input.pressure_pa)];
    const all = [...Object.values(branches).flat(), state, ...marks.map(([, a]) => [T(a.temperature_k), P(a.pressure_pa)])];
    const xs = all.map((a) => a[0]);
    const ys = all.map((a) => a[1]);
    const pad = (lo, hi) => [lo - (hi - lo) * 0.05, hi + (hi - lo) * 0.05];
    const [x0, x1] = pad(Math.min(...xs), Math.max(...xs));
    const [y0, y1] = pad(Math.min(...ys, 0), Math.max(...ys));
    const W = Math.max(420, Math.min(box.clientWidth || 720, 900));
    const H = 360;
    const L = 64, R = 190, Tm = 12, B = 46;
    const sx = (x) => L + ((x - x0) / (x1 - x0)) * (W - L - R);
    const sy = (y) => H - B - ((y - y0) / (y1 - y0)) * (H - Tm - B);
    const svg = svgElement("svg", { width: W, height: H, viewBox: `0 0 ${W} ${H}`, role: "img",
      "aria-label": `${pure ? "vapour-pressure curve" : "phase envelope"}, temperature against pressure` });
    svg.append(svgElement("rect", { x: L, y: Tm, width: W - L - R, height: H - Tm - B, fill: "none", stroke: "#1b2027" }));
    for (const v of ticks(x0, x1, 7)) {
      svg.append(svgElement("line", { x1: sx(v), x2: sx(v), y1: H - B, y2: H - B + 5, stroke: "#1b2027" }));
      svg.append(svgElement("text", { x: sx(v), y: H - B + 18, "text-anchor": "middle" }, String(Number(v.toPrecision(6)))));
    }
    for (const v of ticks(y0, y1, 6)) {
      svg.append(svgElement("line", { x1: L - 5, x2: L, y1: sy(v), y2: sy(v), stroke: "#1b2027" }));
      svg.append(svgElement("text", { x: L - 8, y: sy(v) + 4, "text-anchor": "end" }, String(Number(v.toPrecision(6)))));
    }
    svg.append(svgElement("text", { x: (L + W - R) / 2, y: H - 8, "text-anchor": "middle" }, `Temperature (${s.tUnit})`));
    svg.append(svgElement("text", { x: 14, y: (Tm + H - B) / 2, "text-anchor": "middle",
      transform: `rotate(-90 14 ${(Tm + H - B) / 2})` }, `Pressure (${s.pUnit})`));
    const legend = [];
    const styles = { dew: ["6 4", "dew line"], bubble: ["", "bubble line"], saturation: ["", "saturation"] };
    for (const [name, pts] of Object.entries(branches)) {
      const [dash, label] = styles[name] || ["2 3", name];
      const d = pts.map(([x, y], i) => `${i ? "L" : "M"}${sx(x).toFixed(1)},${sy(y).toFixed(1)}`).join("");
      svg.append(svgElement("path", { d, fill: "none", stroke: "#1b2027", "stroke-width": 2,
        "stroke-dasharray": dash, class: "branch", "data-branch": name }));
      legend.push(["line", dash, label]);
    }
    const marker = (shape, x, y, title) => {
      let e;
      if (shape === "circle") e = svgElement("circle", { cx: x, cy: y, r: 5 });
      else if (shape === "square") e = svgElement("rect", { x: x - 4.5, y: y - 4.5, width: 9, height: 9 });
      else if (shape === "up") e = svgElement("path", { d: `M${x},${y - 6}L${x + 5.5},${y + 4}L${x - 5.5},${y + 4}Z` });
      else e = svgElement("path", { d: `M${x - 7},${y - 7}L${x + 7},${y + 7}M${x - 7},${y + 7}L${x + 7},${y - 7}`, "stroke-width": 3 });
      e.setAttribute("fill", "#fffdf8");
      e.setAttribute("stroke", "#1b2027");
      if (!e.getAttribute("stroke-width")) e.setAttribute("stroke-width", 1.5);
      e.append(svgElement("title", {}, title));
      return e;
    };
    for (const [name, at, shape] of marks) {
      const x = T(at.temperature_k), y = P(at.pressure_pa);
      svg.append(marker(shape, sx(x), sy(y), `${name}: ${fixed(x, 2)} ${s.tUnit}, ${significant(y, 5)} ${s.pUnit}`));
      legend.push([shape, "", name]);
    }
    const st = marker("cross", sx(state[0]), sy(state[1]), `your state: ${s.t}, ${s.p}`);
    st.setAttribute("class", "state-mark");
    svg.append(st);
    legend.push(["cross", "", "your state"]);
    legend.forEach(([shape, dash, label], i) => {
      const x = W - R + 16, y = Tm + 14 + i * 22;
      if (shape === "line") svg.append(svgElement("path", { d: `M${x},${y}L${x + 28},${y}`, stroke: "#1b2027", "stroke-width": 2, "stroke-dasharray": dash }));
      else svg.append(marker(shape, x + 14, y, label));
      svg.append(svgElement("text", { x: x + 36, y: y + 4 }, label));
    });
    box.append(svg);
  }

  function notes(s) {
    const list = $("warnings");
    list.replaceChildren();
    const seen = new Set();
    const add = (text) => {
      if (seen.has(text)) return;
      seen.add(text);
      const li = document.createElement("li");
      li.textContent = text;
      list.append(li);
    };
    for (const w of s.state.warnings) add(w);
    for (const w of s.iso.warnings) add(`isotherm: ${w}`);
    if (s.env) for (const w of s.env.warnings) add(`envelope: ${w}`);
    if (seen.size === 0) add("None for these states.");
    $("caution").textContent = s.state.caution + " Defer to local codes and licensed review.";
  }

  // --- downloads ----------------------------------------------------------------------------

  function sheets() {
    const { s, rows } = shown;
    const side = [COLUMNS.map(([, label]) => label)];
    for (const r of rows) side.push(COLUMNS.map(([key]) => r[key] ?? null));
    const iso = [[`P (${s.pUnit})`, "reference Z", ...s.iso.models.map((m) => `Z ${m.model}`)]];
    for (const p of s.iso.points) {
      iso.push([pressureIn(s.pUnit, p.pressure_pa, s.ambient), p.reference_z ?? null,
        ...s.iso.models.map((m) => (p.values.find((v) => v.model === m.model) || {}).z ?? null)]);
    }
    const out = [
      { name: "side by side", rows: side },
      { name: "isotherm", rows: iso },
    ];
    if (s.env) {
      const env = [[`T (${s.tUnit})`, `P (${s.pUnit})`, "branch"]];
      for (const p of s.env.points) {
        env.push([temperatureIn(s.tUnit, p.temperature_k), pressureIn(s.pUnit, p.pressure_pa, s.ambient), p.branch]);
      }
      out.push({ name: "envelope", rows: env });
    }
    const basis = [["fluid", s.state.fluid], ["temperature", s.t], ["pressure", s.p], ["tool", s.state.tool]];
    for (const w of s.state.warnings) basis.push(["warning", w]);
    basis.push(["caution", s.state.caution]);
    out.push({ name: "basis", rows: basis });
    return out;
  }

  function save(blob, name) {
    const a = document.createElement("a");
    a.href = URL.createObjectURL(blob);
    a.download = name;
    document.body.append(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(a.href), 1000);
  }

  function csvCell(v) {
    if (v === null || v === undefined) return "";
    const t = String(v);
    return /[",\n]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
  }

  function downloadCsv() {
    if (!shown) return;
    const text = sheets()
      .map((sh) => `# ${sh.name}\n` + sh.rows.map((r) => r.map(csvCell).join(",")).join("\n"))
      .join("\n\n");
    save(new Blob([text + "\n"], { type: "text/csv" }), "zfactor.csv");
  }

  async function downloadXlsx() {
    if (!shown) return;
    const r = await fetch("/api/xlsx", {
      method: "POST", headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ sheets: sheets() }),
    });
    if (!r.ok) {
      setStatus((await r.json()).error, true);
      return;
    }
    save(await r.blob(), "zfactor.xlsx");
  }

  // --- start --------------------------------------------------------------------------------

  async function start() {
    $("ask").addEventListener("submit", run);
    $("get-csv").addEventListener("click", downloadCsv);
    $("get-xlsx").addEventListener("click", downloadXlsx);
    try {
      about = await call("/api/about");
      $("demo-gas").addEventListener("click", () => { $("gas").value = about.demo_gas; $("gas").focus(); });
      const [models, fluids] = await Promise.all([call("/api/models"), call("/api/fluids")]);
      catalogue = models.models;
      fillModels();
      const names = $("fluid-names");
      for (const c of fluids.components || []) {
        const o = document.createElement("option");
        o.value = c.name;
        names.append(o);
      }
      document.body.dataset.ready = "true";
    } catch (e) {
      setStatus(`The page could not reach zfactor: ${e.message}`, true);
    }
  }

  start();
})();

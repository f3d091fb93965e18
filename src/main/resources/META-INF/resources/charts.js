// slopewatch charts: a spread's history and a curve's shape as inline SVG, with the number
// formats the page shares. No library: a polyline, a few ticks and the inversion spells are all
// these charts need.
'use strict';

window.slopewatchCharts = (function () {
  const SVG = 'http://www.w3.org/2000/svg';

  function setAttrs(node, attrs) {
    for (const [k, v] of Object.entries(attrs || {})) {
      if (v !== null && v !== undefined) {
        node.setAttribute(k, v);
      }
    }
  }

  function html(tag, attrs, ...children) {
    const node = document.createElement(tag);
    setAttrs(node, attrs);
    node.append(...children.filter(c => c !== null && c !== undefined));
    return node;
  }

  function svg(tag, attrs, ...children) {
    const node = document.createElementNS(SVG, tag);
    setAttrs(node, attrs);
    node.append(...children.filter(c => c !== null && c !== undefined));
    return node;
  }

  // A signed number with a true minus sign; a value that rounds to zero has no sign.
  function signed(v, digits) {
    const text = Math.abs(v).toFixed(digits);
    if (Number(text) === 0) {
      return text;
    }
    return (v < 0 ? '\u2212' : '+') + text;
  }

  function bp(v) {
    return v === null || v === undefined ? '\u2014' : signed(v, 1) + ' bp';
  }

  function day(iso) {              // market date -> days since 1970-01-01
    const [y, m, d] = iso.split('-').map(Number);
    return Date.UTC(y, m - 1, d) / 86400000;
  }

  function isoOfDay(n) {
    return new Date(n * 86400000).toISOString().slice(0, 10);
  }

  function slug(id) {
    return id.replace(/[^A-Za-z0-9_-]/g, '-');
  }

  // Round-numbered ticks, about count of them and never fewer than two.
  function niceTicks(lo, hi, count) {
    const raw = (hi - lo) / Math.max(1, count);
    const mag = Math.pow(10, Math.floor(Math.log10(raw)));
    const step = [1, 2, 2.5, 5, 10].map(m => m * mag).find(st => st >= raw) || 10 * mag;
    const ticks = [];
    for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) {
      ticks.push(Math.abs(v) < step * 1e-9 ? 0 : v);
    }
    return ticks.length < 2 && count < 20 ? niceTicks(lo, hi, count * 2) : { ticks, step };
  }

  function decimals(step) {
    let d = 0;
    while (d < 4 && Math.abs(Math.round(step * Math.pow(10, d)) - step * Math.pow(10, d)) > 1e-6) {
      d++;
    }
    return d;
  }

  function describeHistory(s, points, spells) {
    if (points.length === 0) {
      return s.curve + ' ' + s.spread + ': no history yet.';
    }
    let lo = points[0];
    let hi = points[0];
    for (const p of points) {
      if (p.value_bp < lo.value_bp) lo = p;
      if (p.value_bp > hi.value_bp) hi = p;
    }
    const spellText = spells.length === 0 ? 'No inversion spells.'
      : spells.map(x => 'Spell from ' + (x.start || 'before the chart') + (x.confirmed ? ', confirmed ' + x.confirmed : '')
        + (x.end ? ', ended ' + x.end : ', still open') + '.').join(' ');
    return s.curve + ' ' + s.spread + ' from ' + points[0].date + ' to ' + points[points.length - 1].date + ': latest '
      + bp(points[points.length - 1].value_bp) + ', lowest ' + bp(lo.value_bp) + ' on ' + lo.date + ', highest '
      + bp(hi.value_bp) + ' on ' + hi.date + '. ' + spellText;
  }

  function historyChart(s, points, spells, width) {
    const height = 170;
    const m = { left: 46, right: 10, top: 10, bottom: 24 };
    const label = describeHistory(s, points, spells);
    const chart = svg('svg', { viewBox: '0 0 ' + width + ' ' + height, width, height, role: 'img', 'aria-label': label,
      class: 'history-chart' }, svg('title', null, s.curve + ' ' + s.spread + ' history'));
    if (points.length === 0) {
      chart.append(svg('text', { x: width / 2, y: height / 2, 'text-anchor': 'middle' }, 'No history yet'));
      return chart;
    }
    const days = points.map(p => day(p.date));
    let d0 = days[0];
    let d1 = days[days.length - 1];
    if (d1 === d0) {
      d0 -= 1;
      d1 += 1;
    }
    let lo = Math.min(0, ...points.map(p => p.value_bp));
    let hi = Math.max(0, ...points.map(p => p.value_bp));
    const pad = Math.max(2, (hi - lo) * 0.08);
    lo -= pad;
    hi += pad;
    const { ticks, step } = niceTicks(lo, hi, 4);
    lo = Math.min(lo, ticks[0]);
    hi = Math.max(hi, ticks[ticks.length - 1]);
    const x = d => m.left + (d - d0) / (d1 - d0) * (width - m.left - m.right);
    const y = v => m.top + (hi - v) / (hi - lo) * (height - m.top - m.bottom);

    // the hatch marks the confirmed part of a spell, so it does not rest on colour alone
    const patternId = 'hatch-' + slug(s.id);
    chart.append(svg('defs', null, svg('pattern', { id: patternId, width: 5, height: 5, patternUnits: 'userSpaceOnUse',
      patternTransform: 'rotate(45)' }, svg('rect', { width: 5, height: 5, fill: '#f0d2ca' }),
    svg('line', { x1: 0, y1: 0, x2: 0, y2: 5, stroke: '#c98b7d', 'stroke-width': 1.4 }))));

    // a spell a day or two long still gets a band wide enough to see
    const band = (cls, from, to, fill) => {
      const w = Math.max(5, to - from);
      const left = Math.min(Math.max(m.left, (from + to) / 2 - w / 2), width - m.right - w);
      return svg('rect', { class: cls, x: left, y: m.top, width: w, height: height - m.top - m.bottom, fill });
    };
    const bands = svg('g', { class: 'spells' });
    for (const spell of spells) {
      const a = Math.max(d0, spell.start ? day(spell.start) : d0);
      const b = Math.min(d1, spell.end ? day(spell.end) : d1);
      if (b < a) {
        continue;
      }
      const c = spell.confirmed ? Math.max(a, Math.min(b, day(spell.confirmed))) : b;
      if (c > a || !spell.confirmed) {
        bands.append(band('spell-inverted', x(a), x(c), '#f3e4c4'));
      }
      if (spell.confirmed) {
        bands.append(band('spell-confirmed', x(c), x(b), 'url(#' + patternId + ')'));
      }
    }
    chart.append(bands);

    const axes = svg('g', { class: 'axes' });
    for (const t of ticks) {
      axes.append(svg('line', { x1: m.left, x2: width - m.right, y1: y(t), y2: y(t), stroke: '#ebe6da' }),
        svg('text', { x: m.left - 6, y: y(t) + 4, 'text-anchor': 'end' }, signed(t, decimals(step))));
    }
    const inner = tick => x(tick.day) >= m.left + 20 && x(tick.day) <= width - m.right - 20;
    let xTicks = dateTicks(d0, d1, Math.floor((width - m.left - m.right) / 80)).filter(inner);
    if (xTicks.length < 2) {
      xTicks = points.length === 1 || days[0] === lastOf(days)
        ? [{ day: days[0], label: points[0].date }]
        : [{ day: days[0], label: points[0].date, anchor: 'start' },
          { day: lastOf(days), label: lastOf(points).date, anchor: 'end' }];
    }
    for (const tick of xTicks) {
      axes.append(svg('line', { x1: x(tick.day), x2: x(tick.day), y1: height - m.bottom, y2: height - m.bottom + 4,
        stroke: '#9aa3a8' }), svg('text', { x: x(tick.day), y: height - 6, 'text-anchor': tick.anchor || 'middle' }, tick.label));
    }
    axes.append(svg('line', { x1: m.left, x2: width - m.right, y1: height - m.bottom, y2: height - m.bottom, stroke: '#9aa3a8' }),
      svg('line', { class: 'zero', x1: m.left, x2: width - m.right, y1: y(0), y2: y(0), stroke: '#1f2a30',
        'stroke-dasharray': '5 4', 'stroke-width': 1 }));
    chart.append(axes);

    const d = points.map((p, i) => (i === 0 ? 'M' : 'L') + x(days[i]).toFixed(1) + ' ' + y(p.value_bp).toFixed(1)).join(' ');
    const lastPoint = points[points.length - 1];
    chart.append(svg('path', { class: 'series', d, fill: 'none', stroke: '#24566b', 'stroke-width': 1.8,
      'stroke-linejoin': 'round' }),
    svg('circle', { cx: x(days[days.length - 1]), cy: y(lastPoint.value_bp), r: 3.2, fill: '#24566b' },
      svg('title', null, lastPoint.date + ': ' + bp(lastPoint.value_bp))));
    return chart;
  }

  function lastOf(list) {
    return list[list.length - 1];
  }

  // Month or year ticks that fit, or none for a range too short for two of them.
  function dateTicks(d0, d1, room) {
    const first = new Date(d0 * 86400000);
    for (const months of [1, 2, 3, 6, 12, 24, 60, 120]) {
      const ticks = [];
      let yr = first.getUTCFullYear();
      let mo = first.getUTCMonth() + 1;
      for (;;) {
        const dd = Date.UTC(yr, mo, 1) / 86400000;
        if (dd > d1) break;
        const month = new Date(dd * 86400000).getUTCMonth();
        if (months < 12 ? month % months === 0 : month === 0 && new Date(dd * 86400000).getUTCFullYear() % (months / 12) === 0) {
          ticks.push({ day: dd, label: months >= 12 ? String(new Date(dd * 86400000).getUTCFullYear()) : isoOfDay(dd).slice(0, 7) });
        }
        mo++;
      }
      if (ticks.length <= Math.max(1, room)) {
        return ticks;
      }
    }
    return [];
  }

  // The curve on its latest date, and (dashed, lighter) the same curve three months before when known.
  function curveChart(c, tenors, width, before) {
    const height = 150;
    const m = { left: 40, right: 12, top: 10, bottom: 24 };
    const values = tenors.map(t => c.yields_bp[t] / 100);
    const old = before ? tenors.map(t => (before.yields_bp[t] === undefined ? null : before.yields_bp[t] / 100)) : [];
    const label = c.curve + ' yield curve on ' + c.date + ': ' + tenors.map((t, i) => t + ' ' + values[i].toFixed(2) + ' %').join(', ')
      + (before ? '; on ' + before.date + ': ' + tenors.map((t, i) => t + ' ' + (old[i] === null ? 'not quoted' : old[i].toFixed(2) + ' %')).join(', ') : '');
    const chart = svg('svg', { viewBox: '0 0 ' + width + ' ' + height, width, height, role: 'img', class: 'curve-chart',
      'aria-label': label }, svg('title', null, c.curve + ' yield curve' + (before ? ', now and three months before' : '')));
    if (tenors.length === 0) {
      return chart;
    }
    const all = values.concat(old.filter(v => v !== null));
    let lo = Math.min(...all);
    let hi = Math.max(...all);
    const pad = Math.max(0.05, (hi - lo) * 0.1);
    const { ticks, step } = niceTicks(lo - pad, hi + pad, 3);
    lo = Math.min(lo - pad, ticks[0]);
    hi = Math.max(hi + pad, ticks[ticks.length - 1]);
    // tenors are evenly spaced: the shape across the maturities is what matters here
    const x = i => m.left + (tenors.length === 1 ? 0.5 : i / (tenors.length - 1)) * (width - m.left - m.right);
    const y = v => m.top + (hi - v) / (hi - lo) * (height - m.top - m.bottom);
    for (const t of ticks) {
      chart.append(svg('line', { x1: m.left, x2: width - m.right, y1: y(t), y2: y(t), stroke: '#ebe6da' }),
        svg('text', { x: m.left - 6, y: y(t) + 4, 'text-anchor': 'end' }, t.toFixed(decimals(step))));
    }
    const every = Math.ceil(tenors.length / Math.max(1, Math.floor((width - m.left - m.right) / 34)));
    tenors.forEach((t, i) => {
      if (i % every === 0 || i === tenors.length - 1) {
        chart.append(svg('text', { x: x(i), y: height - 6, 'text-anchor': 'middle' }, t));
      }
    });
    if (before) {
      let d = '';
      let pen = 'M';
      old.forEach((v, i) => {
        if (v === null) {
          pen = 'M';
          return;
        }
        d += pen + x(i).toFixed(1) + ' ' + y(v).toFixed(1) + ' ';
        pen = 'L';
      });
      chart.append(svg('path', { class: 'series-earlier', fill: 'none', stroke: '#9a8f7a', 'stroke-width': 1.5,
        'stroke-dasharray': '5 4', d: d.trim() }, svg('title', null, 'on ' + before.date)));
    }
    chart.append(svg('path', { class: 'series', fill: 'none', stroke: '#24566b', 'stroke-width': 1.8, 'stroke-linejoin': 'round',
      d: values.map((v, i) => (i === 0 ? 'M' : 'L') + x(i).toFixed(1) + ' ' + y(v).toFixed(1)).join(' ') }));
    values.forEach((v, i) => chart.append(svg('circle', { cx: x(i), cy: y(v), r: 2.8, fill: '#ffffff', stroke: '#24566b',
      'stroke-width': 1.5 }, svg('title', null, tenors[i] + ': ' + v.toFixed(2) + ' %'))));
    return chart;
  }

  // The key to a curve chart, as a caption under it: outside the plot, it cannot cover a point
  // wherever the curve happens to lie.
  function curveLegend(c, before) {
    const item = (cls, text) => html('span', { class: 'legend-item' }, html('span', { class: 'swatch ' + cls, 'aria-hidden': 'true' }), text);
    return html('figcaption', { class: 'legend' }, item('swatch-latest', c.date),
      before ? item('swatch-earlier', before.date + ' (three months before)') : null);
  }

  return { historyChart, curveChart, curveLegend, signed, bp, slug, lastOf, setAttrs };
}());

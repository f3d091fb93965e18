// slopewatch dashboard: polls the read API and lays out what it finds (the charts are in charts.js).
// Plain DOM, no framework: the page must work on a machine with no internet and stay small enough to read.
'use strict';

(function () {
  const POLL_MS = 5000;
  const FULL_HISTORY_EVERY = 12;   // polls; between them only the newest dates are fetched
  const MAX_PAGES = 50;            // of one list in one poll: 500,000 items at the API's 10,000 a page
  const RECENT_CHANGES = 15;
  // Quiet periods (an alert rule or a spread whose notices are journalled but not sent): where the API lists them and
  // what its fields are called, in this one line, so that renaming the endpoint or a field is a change here only.
  const QUIET_API = { path: '/api/quiet-periods', rule: 'rule', spread: 'spread', note: 'note', setBy: 'set_by', until: 'until', active: 'active' };
  const { historyChart, curveChart, curveLegend, signed, bp, slug, lastOf, setAttrs } = window.slopewatchCharts;

  // Each state has its own colour (in the CSS) and always its name in words.
  const STATES = {
    NORMAL: { label: 'Normal', note: 'Not inverted.' },
    INVERTED: { label: 'Inverted', note: 'Below the entry threshold; no persistence test has held yet.' },
    CONFIRMED: { label: 'Confirmed', note: 'The inversion has persisted: a persistence test held.' },
    RESTEEPENING: { label: 'Re-steepening', note: 'Back above the exit threshold after a confirmed inversion.' }
  };

  const histories = new Map();   // spread id -> [{date, value_bp}]
  const earlier = new Map();     // curve -> {for: latest date, curve: snapshot three months before (or null)}
  let last = null;               // what the last successful poll read, for redrawing on resize
  let lastGood = null;           // when that was
  let polls = 0;
  let timer = null;
  let busy = false;
  // ?spread=GOVT-A:10Y-3M (the link in every notice) opens the page on that spread's card, once
  const wanted = new URLSearchParams(window.location.search).get('spread');
  let shownWanted = false;
  let token = sessionStorage.getItem('slopewatch-token');
  let quietPeriods = [];         // the active ones, as the last successful read found them

  function authorised(headers) {
    return token ? Object.assign({ Authorization: 'Bearer ' + token }, headers) : headers;
  }

  // Asks for a token when the server wants one; the token stays in this tab's session storage.
  function askForToken(why) {
    const form = document.getElementById('token-form');
    document.getElementById('token-why').textContent = why;
    form.hidden = false;
  }

  document.getElementById('token-form').addEventListener('submit', ev => {
    ev.preventDefault();
    const value = document.getElementById('token-input').value.trim();
    if (value) {
      token = value;
      sessionStorage.setItem('slopewatch-token', value);
      document.getElementById('token-form').hidden = true;
      document.getElementById('token-input').value = '';
      schedule(0);
    }
  });

  // ---- small helpers ----

  function el(tag, attrs, ...children) {
    const node = document.createElement(tag);
    setAttrs(node, attrs);
    node.append(...children.filter(c => c !== null && c !== undefined));
    return node;
  }

  function percent(yieldBp) {
    return yieldBp === null || yieldBp === undefined ? '\u2014' : (yieldBp / 100).toFixed(2);
  }

  function clock(d) {
    return d.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit', second: '2-digit', hour12: false });
  }

  function stateTag(state) {
    const s = STATES[state] || { label: state };
    return el('span', { class: 'state state-' + state, 'data-state': state }, s.label);
  }

  async function fetchJson(url) {
    return (await fetchAnswer(url)).json();
  }

  // A list the API hands out a page at a time: each answer names the next page in a Link header
  // (RFC 8288, rel="next") until the last; the pages joined are the list.
  async function fetchList(url) {
    let items = [];
    let next = url;
    for (let pages = 0; next; pages++) {
      if (pages === MAX_PAGES) {
        throw new Error('GET ' + url + ': more than ' + MAX_PAGES + ' pages');
      }
      const response = await fetchAnswer(next);
      items = items.concat(await response.json());
      const link = /<([^>]*)>\s*;\s*rel="?next"?/.exec(response.headers.get('Link') || '');
      next = link ? link[1] : null;
    }
    return items;
  }

  async function fetchAnswer(url) {
    const abort = new AbortController();
    const t = setTimeout(() => abort.abort(), 8000);
    let response;
    try {
      response = await fetch(url, { cache: 'no-store', headers: authorised({ Accept: 'application/json' }), signal: abort.signal });
    } catch (e) {
      throw new Error('GET ' + url + ': ' + (e.name === 'AbortError' ? 'no answer within 8 s' : 'the server cannot be reached'));
    } finally {
      clearTimeout(t);
    }
    if (response.status === 401) {
      askForToken(token ? 'The access token was not accepted; enter another.' : 'This slopewatch asks for an access token to read.');
    }
    if (!response.ok) {
      throw new Error('GET ' + url + ' answered ' + response.status + (response.statusText ? ' ' + response.statusText : ''));
    }
    return response;
  }

  // ---- reading the API ----

  async function loadHistory(s) {
    const base = '/api/spreads/' + encodeURIComponent(s.id) + '/history';
    const have = histories.get(s.id);
    const full = !have || have.length === 0 || polls % FULL_HISTORY_EVERY === 0;
    if (!full && have.length === s.observations && have[have.length - 1].date === s.date) {
      return;
    }
    let points;
    if (full) {
      points = await fetchList(base);
    } else {
      // the newest date may have been replaced by a later quote, so it is read again
      const from = have[have.length - 1].date;
      const fresh = await fetchList(base + '?from=' + from);
      points = have.filter(p => p.date < from).concat(fresh);
      if (points.length !== s.observations) {
        points = await fetchList(base);   // an earlier date arrived late: start over
      }
    }
    histories.set(s.id, points);
  }

  // The same curve three months before its latest date (the latest market date on or before it).
  async function loadEarlierCurve(c) {
    const known = earlier.get(c.curve);
    if (known && known.for === c.date) {
      return;
    }
    const d = new Date(c.date + 'T00:00:00Z');
    d.setUTCMonth(d.getUTCMonth() - 3);
    const back = d.toISOString().slice(0, 10);
    const response = await fetch('/api/curves/' + encodeURIComponent(c.curve) + '?on_or_before=' + back,
      { cache: 'no-store', headers: authorised({ Accept: 'application/json' }) });
    if (response.status === 404) {
      earlier.set(c.curve, { for: c.date, curve: null });   // no history that far back yet
      return;
    }
    if (!response.ok) {
      throw new Error('GET /api/curves/' + c.curve + ' answered ' + response.status);
    }
    earlier.set(c.curve, { for: c.date, curve: await response.json() });
  }

  // Spells are read off the transitions: entering INVERTED starts one, CONFIRMED confirms it,
  // leaving INVERTED or CONFIRMED for NORMAL or RESTEEPENING ends it. The end of a hold period
  // (RESTEEPENING -> NORMAL) belongs to no spell.
  function spellsBySpread(transitions) {
    const inSpell = st => st === 'INVERTED' || st === 'CONFIRMED';
    const out = new Map();
    for (const t of transitions) {
      if (!inSpell(t.from) && !inSpell(t.to)) {
        continue;
      }
      let spells = out.get(t.spread_id);
      if (!spells) {
        spells = new Map();
        out.set(t.spread_id, spells);
      }
      let spell = spells.get(t.spell_id);
      if (!spell) {
        spell = { id: t.spell_id, start: null, confirmed: null, end: null };
        spells.set(t.spell_id, spell);
      }
      if (t.to === 'INVERTED') {
        spell.start = t.date;
      } else if (t.to === 'CONFIRMED') {
        spell.confirmed = t.date;
      }
      if (inSpell(t.from) && !inSpell(t.to)) {
        spell.end = t.date;
      }
    }
    const result = new Map();
    for (const [id, spells] of out) {
      result.set(id, [...spells.values()]);
    }
    return result;
  }

  async function refresh() {
    if (busy) {
      return;
    }
    busy = true;
    const problems = [];
    try {
      const [spreads, curves, transitions, alerts] = await Promise.all(
        [fetchJson('/api/spreads'), fetchJson('/api/curves'), fetchList('/api/transitions'), fetchJson('/api/alerts?limit=200')]);
      const results = await Promise.allSettled([...spreads.map(loadHistory), ...curves.map(loadEarlierCurve)]);
      results.filter(r => r.status === 'rejected')
        .forEach(r => problems.push('Could not read from the slopewatch API (' + r.reason.message + ').'));
      last = { spreads, curves, transitions, alerts, spells: spellsBySpread(transitions) };
      await loadQuietPeriods();
      lastGood = new Date();
    } catch (e) {
      problems.push('Could not read from the slopewatch API (' + e.message + ').');
    }
    try {
      if (last) {
        render();
      }
    } catch (e) {
      problems.push('The page could not draw what it read (' + e.message + ').');
    } finally {
      polls++;
      busy = false;
      showStatus(problems);
      schedule(POLL_MS);
    }
  }

  function schedule(ms) {
    clearTimeout(timer);
    timer = setTimeout(() => {
      if (document.hidden) {
        schedule(POLL_MS);      // nobody is looking: check again later, read nothing
      } else {
        refresh();
      }
    }, ms);
  }

  function showStatus(problems) {
    const status = document.getElementById('status');
    const problem = document.getElementById('problem');
    const every = 'refreshes every ' + POLL_MS / 1000 + ' s';
    if (problems.length === 0) {
      problem.hidden = true;
      problem.textContent = '';
      status.classList.remove('stale');
      const newest = last.spreads.map(s => s.date).filter(Boolean).sort().pop();
      status.textContent = 'Updated ' + clock(lastGood) + (newest ? ' \u00b7 newest market date ' + newest : '') + ' \u00b7 ' + every;
      return;
    }
    problem.hidden = false;
    problem.replaceChildren(
      el('strong', null, lastGood ? 'The figures may be out of date. ' : 'No figures to show. '),
      problems[0] + ' ',
      lastGood ? 'Showing what was read at ' + clock(lastGood) + '; ' : 'Nothing has been read yet; ',
      'trying again every ' + POLL_MS / 1000 + ' s.');
    status.classList.add('stale');
    status.textContent = lastGood ? 'Last updated ' + clock(lastGood) + ' \u00b7 not current' : 'Not connected';
  }

  // ---- drawing ----

  function render() {
    renderAlerts();
    renderQuiet();
    renderOverview();
    renderSpreads();
    renderCurves();
    renderChanges();
    showWanted();
  }

  // A notice's title without what the alert list shows beside it: the kind and severity at its end
  // (and the bracketed severity in front that titles journalled by earlier versions carry).
  function headline(title) {
    return title.replace(/\s\u2014\s[a-z]+ notice, [a-z]+$/, '').replace(/^\[[A-Z]+\]\s*/, '');
  }

  // Scrolls to the card of the spread the address names and marks it; the card exists only once
  // the first poll has drawn it, so this runs after each drawing until it has found the card.
  function showWanted() {
    if (!wanted || shownWanted) {
      return;
    }
    const card = document.getElementById('spread-' + slug(wanted));
    if (!card) {
      return;
    }
    shownWanted = true;
    card.classList.add('wanted');
    card.setAttribute('aria-current', 'true');
    card.setAttribute('tabindex', '-1');
    card.scrollIntoView({ block: 'start' });
    card.focus({ preventScroll: true });
  }

  // ---- the recession probability, in words ----
  // As the reports say it (probability.ProbabilityText): how far ahead, which spread's average of which
  // month and whether that month is over, the band when the policy gives one, and where the model comes from.
  // The last complete month is shown first; the month so far is marked provisional.

  function monthsBetween(from, to) {
    const [fy, fm] = from.split('-').map(Number);
    const [ty, tm] = to.split('-').map(Number);
    return (ty - fy) * 12 + (tm - fm);
  }

  function pctNumber(p) {
    const v = 100 * p;
    return v < 0.5 || v >= 99.5 ? v.toFixed(1) : v.toFixed(0);
  }

  function pct(p) {
    return pctNumber(p) + ' %';
  }

  function band(p) {
    return p.band90_lower === null || p.band90_lower === undefined ? null
      : '90 % band ' + pctNumber(p.band90_lower) + '\u2013' + pct(p.band90_upper);
  }

  function observations(n) {
    return n + (n === 1 ? ' observation' : ' observations');
  }

  function probabilityText(s, p) {
    return monthsBetween(p.month, p.recession_month) + '-month-ahead recession probability ' + pct(p.value)
      + ' (' + (band(p) || 'no band: the model has no covariance') + '): P(recession in ' + p.recession_month + '), from the '
      + s.spread + ' average of ' + p.month
      + (p.provisional ? ' so far (provisional: month to date, ' + observations(p.observations) + ')'
        : ' (complete month, ' + observations(p.observations) + ')')
      + '; model: ' + (p.model_source || 'no source given');
  }

  // The overview's short form: the same facts but the target month and the model, which the spread's card gives.
  function odds(s) {
    const p = s.probability_last_month || s.probability;
    if (!p) {
      return ['\u2014'];
    }
    const head = pct(p.value) + (band(p) ? ' (' + band(p) + ')' : '') + ', ' + monthsBetween(p.month, p.recession_month)
      + ' months ahead, from the ' + s.spread + ' average of ' + p.month + (p.provisional ? ' so far (provisional)' : '');
    const toDate = s.probability_last_month && s.probability
      ? el('span', { class: 'provisional' }, 'month to date: ' + pct(s.probability.value) + ' (provisional)') : null;
    return [el('span', { class: 'final' }, head), toDate];
  }

  function renderOverview() {
    const rows = document.getElementById('overview-rows');
    const spreads = [...last.spreads].sort((a, b) => a.curve.localeCompare(b.curve));
    rows.replaceChildren(...spreads.map(s => el('tr', { 'data-spread': s.id, 'data-state': s.state },
      el('th', { scope: 'row' }, s.curve + ' ' + s.spread),
      el('td', { class: 'num' }, s.value_bp === null ? '\u2014' : signed(s.value_bp, 1)),
      el('td', null, stateTag(s.state)),
      el('td', { class: 'num' }, String(s.days_inverted)),
      el('td', { class: 'num' }, s.quarter_to_date_average_bp === null ? '\u2014' : signed(s.quarter_to_date_average_bp, 1)),
      el('td', { class: 'odds' }, ...odds(s)),
      el('td', null, el('a', { href: '#spread-' + slug(s.id), class: 'show-chart' }, 'Chart', el('span', { class: 'visually-hidden' },
        ' of ' + s.curve + ' ' + s.spread))))));
  }

  // Open alert episodes, each with the id of its latest notice (rule~subject~since~notices, as the server makes it).
  function renderAlerts() {
    const list = document.getElementById('alert-list');
    const open = last.alerts.open || [];
    document.getElementById('alerts-empty').hidden = open.length > 0;
    const byId = new Map((last.alerts.recent || []).map(a => [a.id, a]));
    const keep = new Set();
    for (const episode of open) {
      const id = episode.rule + '~' + episode.subject + '~' + episode.since + '~' + episode.notices;
      const key = 'alert-' + slug(episode.rule + '-' + episode.subject);
      keep.add(key);
      const notice = byId.get(id);
      let item = document.getElementById(key);
      if (!item) {
        item = el('li', { id: key, class: 'alert-item' });
        list.append(item);
      }
      if (item.dataset.alertId === id && item.dataset.acknowledged === String(episode.acknowledged)) {
        continue;   // unchanged: keep whatever is being typed into the form
      }
      item.dataset.alertId = id;
      item.dataset.acknowledged = String(episode.acknowledged);
      const severity = notice ? notice.severity.toLowerCase() : 'info';
      item.className = 'alert-item severity-' + severity;
      const head = el('p', { class: 'alert-head' }, el('span', { class: 'severity' }, severity), ' ',
        el('strong', null, notice ? headline(notice.title) : episode.rule + ' on ' + episode.subject));
      const meta = el('p', { class: 'muted' }, 'Rule ' + episode.rule + ' \u00b7 since ' + episode.since + ' \u00b7 '
        + episode.notices + (episode.notices === 1 ? ' notice' : ' notices'));
      if (episode.acknowledged) {
        item.replaceChildren(head, meta, el('p', { class: 'acked' }, 'Acknowledged: no more reminders.'));
        continue;
      }
      const inputId = key + '-by';
      const form = el('form', { class: 'ack-form' },
        el('label', { for: inputId }, 'Your name'),
        el('input', { id: inputId, name: 'by', required: 'required', autocomplete: 'name' }),
        el('button', { type: 'submit' }, 'Acknowledge'),
        el('span', { class: 'ack-result', role: 'status' }));
      form.addEventListener('submit', ev => {
        ev.preventDefault();
        acknowledge(id, form);
      });
      item.replaceChildren(head, meta, form);
    }
    for (const item of [...list.children]) {
      if (!keep.has(item.id)) {
        item.remove();
      }
    }
  }

  async function acknowledge(id, form) {
    const by = form.querySelector('input').value.trim();
    const result = form.querySelector('.ack-result');
    if (!by) {
      result.textContent = 'Say who acknowledges.';
      return;
    }
    form.querySelector('button').disabled = true;
    try {
      const response = await fetch('/api/alerts/' + encodeURIComponent(id) + '/ack', {
        method: 'POST', headers: authorised({ 'Content-Type': 'application/json', Accept: 'application/json' }),
        body: JSON.stringify({ by })
      });
      if (response.status === 401 || response.status === 403) {
        askForToken('Acknowledging needs a token with the write role (the demo prints one when it starts).');
      }
      if (!response.ok) {
        const body = await response.json().catch(() => ({}));
        throw new Error(body.detail || ('answered ' + response.status)); // an RFC 9457 problem document
      }
      result.textContent = 'Acknowledged by ' + by + '.';
      schedule(300);
    } catch (e) {
      result.textContent = 'Not acknowledged: ' + e.message;
      form.querySelector('button').disabled = false;
    }
  }

  function renderSpreads() {
    const box = document.getElementById('spread-cards');
    document.getElementById('spreads-empty').hidden = last.spreads.length > 0;
    const keep = new Set();
    // by curve; within a curve, in the order the API gives them (the sort is stable)
    const spreads = [...last.spreads].sort((a, b) => a.curve.localeCompare(b.curve));
    spreads.forEach((s, place) => {
      const id = 'spread-' + slug(s.id);
      keep.add(id);
      let card = document.getElementById(id);
      if (!card) {
        card = el('article', { class: 'card', id, 'aria-labelledby': id + '-title' },
          el('div', { class: 'card-head' }, el('h3', { id: id + '-title' },
            el('span', { class: 'curve' }, s.curve), ' ', s.spread), el('span', { class: 'slot-state' })),
          el('div', { class: 'reading' }), el('p', { class: 'state-note' }), el('dl', { class: 'facts' }),
          el('div', { class: 'probability' }), el('figure', { class: 'history' }));
      }
      if (box.children[place] !== card) {
        box.insertBefore(card, box.children[place] || null);
      }
      fillSpread(card, s);
    });
    for (const card of [...box.children]) {
      if (!keep.has(card.id)) {
        card.remove();
      }
    }
  }

  function fillSpread(card, s) {
    card.className = 'card is-' + s.state + (wanted === s.id ? ' wanted' : '');
    card.dataset.spread = s.id;
    card.dataset.state = s.state;
    card.querySelector('.slot-state').replaceChildren(stateTag(s.state));
    card.querySelector('.reading').replaceChildren(
      el('span', { class: 'value', 'data-value-bp': s.value_bp }, s.value_bp === null ? '\u2014' : signed(s.value_bp, 1),
        el('span', { class: 'unit' }, 'bp')),
      el('span', { class: 'asof' }, s.date ? 'on ' + s.date : 'no value yet'));
    card.querySelector('.state-note').textContent = (STATES[s.state] || { note: '' }).note;

    const facts = [
      ['Days inverted', s.inverted_since ? s.days_inverted + ' (without a break since ' + s.inverted_since + ')' : '0'],
      ['Quarter to date', s.quarter_to_date_average_bp === null ? 'no observations yet'
        : 'average ' + bp(s.quarter_to_date_average_bp) + ' over ' + s.quarter_to_date_observations
          + (s.quarter_to_date_observations === 1 ? ' observation' : ' observations')],
      ['Open spell', openSpell(s.spell, last.spells.get(s.id) || [])]
    ];
    if (s.spell) {
      facts.push(['Deepest so far', bp(s.spell.deepest_bp) + ' on ' + s.spell.deepest_date]);
    }
    // a confirmed card gives these in its headline figures, large; the list keeps the rest
    const listed = s.state === 'CONFIRMED' ? facts.filter(([k]) => !IN_HEADLINE.has(k)) : facts;
    card.querySelector('.facts').replaceChildren(...listed.flatMap(([k, v]) => [el('dt', null, k), el('dd', null, v)]));
    // a sentence each, the width of the card: the last complete month first, the month so far after it
    const odds = [];
    if (s.probability_last_month) {
      odds.push(el('p', { class: 'final' }, el('strong', null, 'Recession probability: '), probabilityText(s, s.probability_last_month)));
    }
    if (s.probability) {
      odds.push(el('p', { class: 'provisional' }, el('strong', null, (s.probability_last_month ? 'Month to date (provisional)'
        : 'Recession probability (provisional)') + ': '), probabilityText(s, s.probability)));
    }
    card.querySelector('.probability').replaceChildren(...odds);
    fillConfirmed(card, s);
    markQuiet(card, s);

    const figure = card.querySelector('.history');
    // the chart ends where the figures above it end, even if a newer date arrived in between
    const points = (histories.get(s.id) || []).filter(p => !s.date || p.date <= s.date);
    const spells = mergeOpenSpell((last.spells.get(s.id) || []), s.spell);
    const width = Math.max(260, Math.round(figure.clientWidth || 520));
    figure.replaceChildren(historyChart(s, points, spells, width), historyCaption(points, spells));
  }

  function openSpell(spell, known) {
    if (!spell) {
      const ended = known.filter(x => x.end).map(x => x.end).sort();
      return ended.length ? 'none; the last one ended ' + lastOf(ended) : 'none';
    }
    return 'since ' + spell.start + (spell.confirmed
      ? ', confirmed ' + spell.confirmed + (spell.confirmed_by ? ' (' + spell.confirmed_by + ')' : '')
      : ', not confirmed yet');
  }

  // the status's open spell is authoritative for the spell still running
  function mergeOpenSpell(spells, open) {
    if (!open) {
      return spells;
    }
    const others = spells.filter(x => x.id !== open.id);
    return others.concat([{ id: open.id, start: open.start, confirmed: open.confirmed, end: null }]);
  }

  function historyCaption(points, spells) {
    if (points.length === 0) {
      return el('figcaption', null, 'No history yet.');
    }
    return el('figcaption', null,
      points[0].date + ' to ' + points[points.length - 1].date + ' \u00b7 dashed line: 0 bp',
      spells.length ? el('span', { class: 'keyed' }, el('span', { class: 'key key-open', 'aria-hidden': 'true' }), 'inverted') : null,
      spells.some(x => x.confirmed) ? el('span', { class: 'keyed' }, el('span', { class: 'key key-confirmed', 'aria-hidden': 'true' }), 'confirmed')
        : null);
  }

  function renderCurves() {
    const box = document.getElementById('curve-cards');
    const curves = [...last.curves].sort((a, b) => a.curve.localeCompare(b.curve));
    document.getElementById('curves-empty').hidden = curves.length > 0;
    const keep = new Set();
    curves.forEach((c, place) => {
      const id = 'curve-' + slug(c.curve);
      keep.add(id);
      let card = document.getElementById(id);
      if (!card) {
        card = el('article', { class: 'card curve-card', id, 'aria-labelledby': id + '-title' },
          el('div', { class: 'card-head' }, el('h3', { id: id + '-title' }, c.curve), el('span', { class: 'asof' })),
          el('figure', { class: 'curve-shape' }), el('div', { class: 'table-scroll' }));
      }
      if (box.children[place] !== card) {
        box.insertBefore(card, box.children[place] || null);
      }
      card.dataset.curve = c.curve;
      card.querySelector('.asof').textContent = 'market date ' + c.date;
      const before = (earlier.get(c.curve) || {}).curve || null;
      const tenors = Object.keys(c.yields_bp);
      const figure = card.querySelector('.curve-shape');
      const width = Math.max(260, Math.round(figure.clientWidth || 520));
      const then = before && before.date !== c.date ? before : null;
      figure.replaceChildren(curveChart(c, tenors, width, then), curveLegend(c, then));
      fitYieldTable(card.querySelector('.table-scroll'), c, tenors, then);
    });
    for (const card of [...box.children]) {
      if (!keep.has(card.id)) {
        card.remove();
      }
    }
  }

  function renderChanges() {
    const rows = document.getElementById('changes-rows');
    const recent = [...last.transitions]
      .sort((a, b) => (a.date === b.date ? b.id - a.id : a.date < b.date ? 1 : -1))
      .slice(0, RECENT_CHANGES);
    document.getElementById('changes-empty').hidden = recent.length > 0;
    document.getElementById('changes-table').hidden = recent.length === 0;
    rows.replaceChildren(...recent.map(t => el('tr', { 'data-spread': t.spread_id, 'data-to': t.to },
      el('td', null, t.date),
      el('td', null, t.spread_id.replace(':', ' ')),
      el('td', null, stateTag(t.from), el('span', { class: 'arrow', 'aria-label': 'to' }, '\u2192'), stateTag(t.to)),
      el('td', { class: 'reason' }, t.reason))));
  }

  // ---- a confirmed inversion, unmistakable ----

  // the facts a confirmed card shows large in its headline instead of in its list
  const IN_HEADLINE = new Set(['Days inverted', 'Deepest so far', 'Recession odds']);

  // A confirmed card gets a banner and its key figures large; any other state gets neither and stays calm.
  function fillConfirmed(card, s) {
    let banner = card.querySelector('.alarm-banner');
    let headline = card.querySelector('.headline');
    if (s.state !== 'CONFIRMED') {
      if (banner) banner.remove();
      if (headline) headline.remove();
      return;
    }
    if (!banner) {
      banner = el('p', { class: 'alarm-banner' });
      card.prepend(banner);
    }
    if (!headline) {
      headline = el('dl', { class: 'headline' });
      card.querySelector('.reading').after(headline);
    }
    const spell = s.spell || {};
    banner.replaceChildren(el('span', { class: 'alarm-word' }, 'Confirmed inversion'),
      spell.confirmed ? el('span', { class: 'alarm-since' }, 'since ' + spell.confirmed) : null);
    const reason = confirmingReason(s);
    const tiles = [
      ['deepest', 'Deepest', bp(spell.deepest_bp), spell.deepest_date ? 'on ' + spell.deepest_date : null],
      // counted from the first day of the run below zero without a break, as the API and the notices count them
      ['days', 'Days inverted', String(s.days_inverted), s.inverted_since ? 'since ' + s.inverted_since : null],
      ['test', 'Test that held', spell.confirmed_by || 'not recorded', reason]
    ];
    // the last complete month's value by default, as the overview and the notices give it; the month so far beside it
    const p = s.probability_last_month || s.probability;
    if (p) {
      const toDate = s.probability_last_month && s.probability ? '; month to date ' + pct(s.probability.value) + ' (provisional)' : '';
      tiles.push(['odds', 'Recession odds', pct(p.value), 'P(recession in ' + p.recession_month + ')'
        + (band(p) ? ', ' + band(p) : '') + ', from the ' + s.spread + ' average of ' + p.month
        + (p.provisional ? ' so far (provisional, ' : ' (complete month, ') + observations(p.observations) + ')' + toDate
        + '; a statistical signal only']);
    }
    headline.replaceChildren(...tiles.map(([key, label, figure, detail]) => el('div', { class: 'tile', 'data-fact': key },
      el('dt', null, label), el('dd', null, el('span', { class: 'figure' }, figure), detail ? el('span', { class: 'detail' }, detail) : null))));
  }

  // the reason the monitor gave when this spell was confirmed, if the transitions read hold it
  function confirmingReason(s) {
    if (!s.spell) {
      return null;
    }
    const t = last.transitions.find(x => x.spread_id === s.id && x.to === 'CONFIRMED' && x.spell_id === s.spell.id);
    return t ? t.reason : null;
  }

  // ---- quiet periods and acknowledgements ----

  let quietReadAt = null;        // when the quiet periods were last read, or null
  let quietFailed = false;       // whether the last try to read them failed

  // Read apart from the rest: without them the figures are still current, so a failure is said in their panel only.
  async function loadQuietPeriods() {
    try {
      const all = await fetchJson(QUIET_API.path);
      quietPeriods = all.filter(q => q[QUIET_API.active]);
      quietReadAt = new Date();
      quietFailed = false;
    } catch (e) {
      quietFailed = true;
    }
  }

  // an instant as the desk's shared clock shows it: minutes, UTC
  function utc(instant) {
    const m = /^(\d{4}-\d\d-\d\d)T(\d\d:\d\d)/.exec(String(instant));
    return m && /Z$/.test(instant) ? m[1] + ' ' + m[2] + ' UTC' : String(instant);
  }

  // what a quiet period covers: the rule it names, or the spread
  function quietTarget(q) {
    return q[QUIET_API.rule] ?? q[QUIET_API.spread];
  }

  function quietSubject(q) {
    const target = quietTarget(q);
    if (q[QUIET_API.rule] != null) {
      return 'Alert rule ' + target;
    }
    return target.includes(':') ? target.replace(':', ' ') : target + ' on every curve';
  }

  // The quiet periods that silence a spread: one on the spread (on its curve or on every curve), or one on a rule
  // whose condition holds for it now.
  function quietFor(s) {
    const rulesOn = new Set((last.alerts.open || []).filter(e => e.subject === s.id).map(e => e.rule));
    return quietPeriods.filter(q => (q[QUIET_API.rule] != null ? rulesOn.has(q[QUIET_API.rule])
      : q[QUIET_API.spread] === s.id || q[QUIET_API.spread] === s.spread));
  }

  function markQuiet(card, s) {
    const quiet = quietFor(s);
    let note = card.querySelector('.quiet-note');
    card.classList.toggle('is-quiet', quiet.length > 0);
    card.dataset.quiet = String(quiet.length > 0);
    if (quiet.length === 0) {
      if (note) note.remove();
      return;
    }
    if (!note) {
      note = el('p', { class: 'quiet-note' });
      card.querySelector('.card-head').after(note);
    }
    const longest = quiet.reduce((a, b) => (a[QUIET_API.until] >= b[QUIET_API.until] ? a : b));
    note.replaceChildren(el('span', { class: 'quiet-tag' }, 'Quiet period'),
      ' until ' + utc(longest[QUIET_API.until]) + ', set by ' + longest[QUIET_API.setBy]
      + ': alerts for it are journalled, not sent.');
  }

  // An acknowledged episode sends no reminders until its condition clears; who acknowledged it is on its notices.
  function acknowledgements() {
    const recent = last.alerts.recent || [];
    return (last.alerts.open || []).filter(e => e.acknowledged).map(e => {
      const prefix = e.rule + '~' + e.subject + '~' + e.since + '~';
      const acks = recent.filter(a => a.id.startsWith(prefix)).flatMap(a => a.acks || []);
      acks.sort((a, b) => (a.at < b.at ? 1 : -1));
      return { episode: e, ack: acks[0] || null };
    });
  }

  function renderQuiet() {
    const items = quietPeriods.map(q => el('li', { class: 'quiet-item', 'data-target': quietTarget(q) },
      el('span', { class: 'quiet-tag' }, 'Quiet period'), ' ', el('strong', null, quietSubject(q)),
      ' until ', el('time', { datetime: q[QUIET_API.until], class: 'until' }, utc(q[QUIET_API.until])),
      ', set by ', el('span', { class: 'who' }, q[QUIET_API.setBy]),
      q[QUIET_API.note] ? el('span', { class: 'note' }, ': ' + q[QUIET_API.note]) : null));
    for (const { episode, ack } of acknowledgements()) {
      items.push(el('li', { class: 'ack-item', 'data-rule': episode.rule, 'data-subject': episode.subject },
        el('span', { class: 'ack-tag' }, 'Acknowledged'), ' ', el('strong', null, episode.subject.replace(':', ' ')),
        ', rule ' + episode.rule,
        ack ? el('span', null, ' by ', el('span', { class: 'who' }, ack.by), ' at ', el('time', { datetime: ack.at }, utc(ack.at))) : null,
        ': no reminders until the condition clears', ack && ack.note ? el('span', { class: 'note' }, ' (' + ack.note + ')') : null));
    }
    document.getElementById('quiet-list').replaceChildren(...items);
    document.getElementById('quiet-empty').hidden = items.length > 0;
    const stale = document.getElementById('quiet-stale');
    stale.hidden = !quietFailed;
    stale.textContent = quietFailed ? 'The quiet periods could not be read just now' + (quietReadAt
      ? '; these are as read at ' + clock(quietReadAt) + '.' : '.') : '';
  }

  // ---- curve tables that fit their card ----

  // Tenors across when that fits the card; otherwise (a narrow screen, many tenors) down the side, so that no
  // column is cut off or hidden behind a scroll bar.
  function fitYieldTable(box, c, tenors, before) {
    box.replaceChildren(yieldTable(c, tenors, before, true));
    if (box.scrollWidth > box.clientWidth) {
      box.replaceChildren(yieldTable(c, tenors, before, false));
    }
  }

  function yieldTable(c, tenors, before, across) {
    const dates = before ? [c, before] : [c];
    const caption = el('caption', { class: 'visually-hidden' }, c.curve + ' yields in percent on ' + dates.map(d => d.date).join(' and '));
    const earlier = i => (i > 0 ? 'earlier' : null);
    if (across) {
      return el('table', { class: 'yields across' }, caption, el('tbody', null,
        el('tr', null, el('th', { scope: 'row' }, 'Yield %'), ...tenors.map(t => el('th', { scope: 'col' }, t))),
        ...dates.map((d, i) => el('tr', { class: earlier(i) }, el('th', { scope: 'row' }, d.date),
          ...tenors.map(t => el('td', null, percent(d.yields_bp[t])))))));
    }
    return el('table', { class: 'yields down' }, caption,
      el('thead', null, el('tr', null, el('th', { scope: 'col' }, 'Tenor'),
        ...dates.map((d, i) => el('th', { scope: 'col', class: earlier(i) }, d.date + ' %')))),
      el('tbody', null, ...tenors.map(t => el('tr', null, el('th', { scope: 'row' }, t),
        ...dates.map((d, i) => el('td', { class: earlier(i) }, percent(d.yields_bp[t])))))));
  }

  // ---- start ----

  let resizeTimer = null;
  window.addEventListener('resize', () => {
    clearTimeout(resizeTimer);
    resizeTimer = setTimeout(() => last && render(), 150);
  });
  document.addEventListener('visibilitychange', () => {
    if (!document.hidden) {
      schedule(0);
    }
  });
  refresh();
}());

/**
 * The report page's one script, hand-written and inlined (the page's Content-Security-Policy allows
 * it by its SHA-256 and nothing else). It reads the page's data (`#page-data`, see PageData), shows
 * the cap and length controls, and on every `input` recomputes from sums between stops the figures
 * marked `data-live`: the OOV, truncation, dropped and padding cards, each label's OOV rate,
 * truncated share, dropped tokens and padding share, the chosen markers of the coverage chart and the length histogram, and the
 * `lexlock build` line. Numbers are formatted as formatCount and formatPercent format them.
 */
export const PAGE_SCRIPT = String.raw`
(function () {
  'use strict';
  var source = document.getElementById('page-data');
  var controls = document.getElementById('controls');
  if (source === null || controls === null) return;
  var data = JSON.parse(source.textContent);
  var SPACE = '\u00a0';

  function count(n, decimals) {
    if (!isFinite(n)) return String(n);
    var fixed = Math.abs(n).toFixed(decimals || 0);
    var parts = fixed.split('.');
    var grouped = parts[0].replace(/\B(?=(\d{3})+(?!\d))/g, ',');
    var sign = n < 0 && Number(fixed) !== 0 ? '\u2212' : '';
    return sign + grouped + (parts.length > 1 ? '.' + parts[1] : '');
  }
  function percent(share) {
    if (!isFinite(share)) return '\u2013' + SPACE + '%';
    var pct = share * 100;
    var magnitude = Math.abs(pct);
    var sign = pct < 0 ? '\u2212' : '';
    if (pct === 0 || pct === 100) return count(pct) + SPACE + '%';
    if (pct < 100 && pct >= 99.995) return '>' + SPACE + '99.99' + SPACE + '%';
    if (magnitude < 0.0001) return sign + '<' + SPACE + '0.0001' + SPACE + '%';
    var small = magnitude.toPrecision(2);
    if (Number(small) < 1) return sign + small + SPACE + '%';
    return count(pct, magnitude >= 10 && magnitude < 99 ? 1 : 2) + SPACE + '%';
  }
  function shareOf(part, whole) { return whole > 0 ? part / whole : 0; }
  function stopsOf(grid) {
    var seen = {}, out = [], v;
    function put(x) { if (!seen[x]) { seen[x] = true; out.push(x); } }
    for (v = 0; v <= Math.min(grid.exactTo, grid.last); v++) put(v);
    for (v = grid.exactTo + grid.step; v < grid.last; v += grid.step) put(v);
    if (grid.last > grid.exactTo) put(grid.last);
    grid.extra.forEach(put);
    return out.sort(function (a, b) { return a - b; });
  }
  function running(values) {
    var out = [], sum = 0;
    for (var i = 0; i < values.length; i++) { sum += values[i]; out.push(sum); }
    return out;
  }
  /** The index of the stop nearest a value (the lower of two as near). */
  function nearest(stops, value) {
    var best = 0;
    for (var i = 1; i < stops.length; i++) if (Math.abs(stops[i] - value) < Math.abs(stops[best] - value)) best = i;
    return best;
  }

  var capStops = stopsOf(data.cap.grid);
  var lengthStops = stopsOf(data.length.grid);
  function prepare(s) {
    return { name: s.name, documents: s.documents, tokens: s.tokens, kept: running(s.kept), whole: running(s.documentsUpTo), wholeTokens: running(s.tokensUpTo) };
  }
  var overall = prepare(data.overall);
  var byName = {};
  data.labels.forEach(function (s) { byName['=' + s.name] = prepare(s); });

  function figures(s, capIndex, lengthIndex, length) {
    var whole = s.whole[lengthIndex], wholeTokens = s.wholeTokens[lengthIndex];
    var truncated = s.documents - whole;
    return {
      kept: s.kept[capIndex],
      oov: s.tokens - s.kept[capIndex],
      truncated: truncated,
      dropped: s.tokens - wholeTokens - length * truncated,
      padding: length * whole - wholeTokens
    };
  }

  function live(name) { return document.querySelector('[data-live="' + name + '"]'); }
  function put(name, text) { var e = live(name); if (e !== null) e.textContent = text; }
  function scaleOf(text) {
    var p = text.split(' ');
    var d0 = Number(p[1]), d1 = Number(p[2]), r0 = Number(p[3]), r1 = Number(p[4]);
    return function (v) {
      if (p[0] === 'log') {
        var l0 = Math.log10(d0), span = Math.log10(d1) - l0;
        return span === 0 ? (r0 + r1) / 2 : r0 + ((Math.log10(Math.max(v, d0)) - l0) / span) * (r1 - r0);
      }
      return d1 === d0 ? (r0 + r1) / 2 : r0 + ((v - d0) / (d1 - d0)) * (r1 - r0);
    };
  }
  /** Moves a chosen marker (line, dot, label) to x (data units) and gives its label new text. */
  function moveMarker(name, x, y, label) {
    var text = document.querySelector('[data-live="' + name + '"]');
    if (text === null) return;
    var group = text.parentNode;
    var xs = scaleOf(group.getAttribute('data-x-scale'));
    var p = group.getAttribute('data-x-scale').split(' ');
    var lo = Math.min(Number(p[3]), Number(p[4])), hi = Math.max(Number(p[3]), Number(p[4]));
    var at = Math.round(Math.min(hi, Math.max(lo, xs(x))) * 100) / 100;
    var line = group.querySelector('[data-live-line="' + name + '"]');
    if (line !== null) { line.setAttribute('x1', at); line.setAttribute('x2', at); }
    var dot = group.querySelector('[data-live-dot="' + name + '"]');
    if (dot !== null && y !== null && group.getAttribute('data-y-scale') !== null) {
      dot.setAttribute('cx', at);
      dot.setAttribute('cy', Math.round(scaleOf(group.getAttribute('data-y-scale'))(y) * 100) / 100);
    }
    text.textContent = label;
    var third = (hi - lo) / 3;
    text.setAttribute('text-anchor', at < lo + third ? 'start' : at > hi - third ? 'end' : 'middle');
    text.setAttribute('x', at);
    // A suggestion's label the moved one would cover is hidden while it does (its dashed line stays).
    var box = text.getBBox();
    Array.prototype.forEach.call(group.querySelectorAll('text.marker-suggestion'), function (other) {
      var b = other.getBBox();
      var apart = b.x + b.width < box.x || box.x + box.width < b.x || b.y + b.height < box.y || box.y + box.height < b.y;
      other.style.visibility = apart ? '' : 'hidden';
    });
  }

  var capRange = document.getElementById('cap-range');
  var capNumber = document.getElementById('cap-number');
  var lengthRange = document.getElementById('length-range');
  var lengthNumber = document.getElementById('length-number');
  var buildLine = document.getElementById('build-line');

  function update() {
    var capIndex = Number(capRange.value), lengthIndex = Number(lengthRange.value);
    var cap = capStops[capIndex], length = lengthStops[lengthIndex];
    capRange.setAttribute('aria-valuetext', 'cap ' + count(cap));
    lengthRange.setAttribute('aria-valuetext', 'length ' + count(length));
    var all = figures(overall, capIndex, lengthIndex, length);
    put('oov-figure', percent(shareOf(all.oov, overall.tokens)));
    put('oov-detail', count(all.oov) + ' token occurrences with no id of their own');
    put('truncated-figure', percent(shareOf(all.truncated, overall.documents)));
    put('truncated-detail', count(all.truncated) + ' longer than ' + count(length) + ' tokens');
    put('dropped-figure', count(all.dropped));
    put('dropped-detail', percent(shareOf(all.dropped, overall.tokens)) + ' of all tokens, cut from the ' + data.cut + ' of long documents');
    var slots = overall.documents * length;
    put('padding-figure', count(all.padding));
    put('padding-detail', percent(shareOf(all.padding, slots)) + ' of the ' + count(slots) + ' ids, zeros at the ' + data.pad + ' of short rows');
    Array.prototype.forEach.call(document.querySelectorAll('[data-live^="label-"]'), function (cell) {
      var s = byName['=' + cell.getAttribute('data-row')];
      if (s === undefined) return;
      var f = figures(s, capIndex, lengthIndex, length);
      var what = cell.getAttribute('data-live');
      if (what === 'label-oov') cell.textContent = percent(shareOf(f.oov, s.tokens));
      else if (what === 'label-truncated') cell.textContent = percent(shareOf(f.truncated, s.documents));
      else if (what === 'label-dropped') cell.textContent = count(f.dropped);
      else if (what === 'label-padding') cell.textContent = percent(shareOf(f.padding, s.documents * length));
    });
    var covered = shareOf(all.kept, overall.tokens);
    moveMarker('cap-marker', cap, covered * 100, 'chosen cap ' + count(cap) + ': ' + percent(covered) + ' covered' + (data.ranking === 'lexicon' ? ' by the lexicon' : ''));
    moveMarker('length-marker', length + 0.5, null, 'chosen length ' + count(length) + ': ' + percent(shareOf(all.truncated, overall.documents)) + ' truncated');
    var words = ['lexlock', 'build'].concat(data.build.head, ['--cap', String(cap), '--length', String(length), '--pad', data.pad, '--cut', data.cut], data.build.tail);
    // Each word in a span of its own (kept on one line by the page's style), a space between.
    buildLine.textContent = '';
    words.forEach(function (word, i) {
      if (i > 0) buildLine.appendChild(document.createTextNode(' '));
      var span = document.createElement('span');
      span.textContent = word;
      buildLine.appendChild(span);
    });
  }

  function follow(range, number, stops) {
    range.addEventListener('input', function () { number.value = String(stops[Number(range.value)]); update(); });
    number.addEventListener('input', function () {
      if (number.value === '' || !isFinite(Number(number.value))) return;
      range.value = String(Math.max(Number(range.min), nearest(stops, Number(number.value))));
      update();
    });
    number.addEventListener('change', function () { number.value = String(stops[Number(range.value)]); });
  }
  follow(capRange, capNumber, capStops);
  follow(lengthRange, lengthNumber, lengthStops);
  controls.hidden = false;
  var off = document.getElementById('controls-off');
  if (off !== null) off.hidden = true;
})();
`;

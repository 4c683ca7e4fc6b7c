// Sorting and filtering of folio tables. The pages are complete without it: every row is in the HTML (the
// parts index in pages that link each other).
(function () {
  'use strict';

  function cellValue(row, index, numeric) {
    var cell = row.cells[index];
    var raw = cell ? cell.getAttribute('data-value') || cell.textContent || '' : '';
    if (!numeric) return raw.toLowerCase();
    var n = parseFloat(raw);
    return isNaN(n) ? Infinity : n;
  }

  function makeSortable(table) {
    var headers = table.tHead ? table.tHead.rows[0].cells : [];
    Array.prototype.forEach.call(headers, function (th, index) {
      if (!th.hasAttribute('data-key')) return;
      var button = document.createElement('button');
      button.type = 'button';
      while (th.firstChild) button.appendChild(th.firstChild);
      th.appendChild(button);
      button.addEventListener('click', function () {
        var numeric = th.getAttribute('data-type') === 'number';
        var ascending = th.getAttribute('aria-sort') !== 'ascending';
        Array.prototype.forEach.call(headers, function (h) { h.removeAttribute('aria-sort'); });
        th.setAttribute('aria-sort', ascending ? 'ascending' : 'descending');
        var body = table.tBodies[0];
        var rows = Array.prototype.slice.call(body.rows);
        rows.sort(function (a, b) {
          var x = cellValue(a, index, numeric);
          var y = cellValue(b, index, numeric);
          var order = x < y ? -1 : x > y ? 1 : 0;
          return ascending ? order : -order;
        });
        rows.forEach(function (r) { body.appendChild(r); });
      });
    });
  }

  function makeFilterable(form, table) {
    form.hidden = false;
    var query = form.elements.namedItem('q');
    var kind = form.elements.namedItem('kind');
    var count = form.elements.namedItem('count');
    function apply() {
      var words = query.value.toLowerCase().split(/\s+/).filter(Boolean);
      var wantKind = kind.value;
      var shown = 0;
      Array.prototype.forEach.call(table.tBodies[0].rows, function (row) {
        var text = row.getAttribute('data-search') || '';
        var ok = (!wantKind || row.getAttribute('data-kind') === wantKind) &&
          words.every(function (w) { return text.indexOf(w) >= 0; });
        row.hidden = !ok;
        if (ok) shown++;
      });
      count.value = shown + ' of ' + table.tBodies[0].rows.length + ' shown';
    }
    query.addEventListener('input', apply);
    kind.addEventListener('change', apply);
    form.addEventListener('submit', function (e) { e.preventDefault(); });
    apply();
  }

  // The parts index in pages (src/folio/part-list.ts): each page holds its own rows; sorting and filtering
  // work on every part, whose rows the page loads (as scripts, which a page opened from the file system may
  // load) the first time they are needed, and then draws one page of the result at a time.
  // Row fields, in the order indexRow writes them.
  var F = { id: 0, title: 1, kind: 2, kindLabel: 3, nominalText: 4, nominal: 5, pkg: 6, ratingText: 7, rating: 8,
    srfText: 9, srf: 10, bandText: 11, band: 12, tags: 13, search: 14, mainsLabel: 15, mainsTitle: 16 };
  // Sort keys of the table's headings, and the field each sorts by.
  var SORT_FIELD = { id: F.id, kind: F.kind, nominal: F.nominal, 'package': F.pkg, rating: F.rating, srf: F.srf, band: F.band, tags: F.tags };

  function element(name, attributes, children) {
    var e = document.createElement(name);
    Object.keys(attributes || {}).forEach(function (k) { e.setAttribute(k, attributes[k]); });
    (children || []).forEach(function (c) { e.appendChild(typeof c === 'string' ? document.createTextNode(c) : c); });
    return e;
  }

  function rowElement(r, root) {
    var first = element('td', { 'data-value': r[F.id] }, [element('a', { 'class': 'mono', href: root + 'parts/' + r[F.id] + '/index.html' }, [r[F.id]])]);
    if (r[F.mainsLabel]) {
      first.appendChild(document.createTextNode(' '));
      first.appendChild(element('abbr', { 'class': 'mains-mark', title: r[F.mainsTitle] }, [element('span', { 'aria-hidden': 'true' }, ['\u26a0 ']), r[F.mainsLabel]]));
      first.appendChild(element('span', { 'class': 'visually-hidden' }, [': ' + r[F.mainsTitle]]));
    }
    first.appendChild(element('br'));
    first.appendChild(element('span', { 'class': 'sub' }, [r[F.title]]));
    var cell = function (value, text, numeric) { return element('td', numeric ? { 'class': 'num', 'data-value': String(value) } : { 'data-value': String(value) }, [text]); };
    return element('tr', { 'data-kind': r[F.kind], 'data-search': r[F.search] }, [
      first,
      cell(r[F.kind], r[F.kindLabel]),
      cell(r[F.nominal], r[F.nominalText], true),
      cell(r[F.pkg], r[F.pkg]),
      cell(r[F.rating], r[F.ratingText], true),
      cell(r[F.srf], r[F.srfText], true),
      cell(r[F.band], r[F.bandText], true),
      cell(r[F.tags], r[F.tags]),
    ]);
  }

  function makePaged(form, table) {
    var root = table.getAttribute('data-root') || '';
    var size = Number(table.getAttribute('data-page-size'));
    var total = Number(table.getAttribute('data-total'));
    var chunks = table.getAttribute('data-chunks').split(' ');
    var query = form.elements.namedItem('q');
    var kind = form.elements.namedItem('kind');
    var count = form.elements.namedItem('count');
    var pagers = document.querySelectorAll('[data-pager]');
    var received = [];
    var rows = null;
    var waiting = [];
    var state = { page: 0, sort: null, ascending: true };

    window.zfolioIndexRows = function (index, data) { received[index] = data; };
    function load(then) {
      if (rows) return then();
      waiting.push(then);
      if (waiting.length > 1) return;
      count.value = 'loading ' + total + ' parts\u2026';
      var left = chunks.length;
      chunks.forEach(function (src) {
        var script = element('script', { src: src });
        script.addEventListener('load', function () {
          if (--left > 0) return;
          rows = [].concat.apply([], received);
          waiting.splice(0).forEach(function (f) { f(); });
        });
        script.addEventListener('error', function () { count.value = 'could not load the list of parts (' + src + ')'; });
        document.head.appendChild(script);
      });
    }

    function pagerButton(label, page, current) {
      var b = element('button', { type: 'button' }, [label]);
      if (current) { b.disabled = true; b.setAttribute('aria-current', 'page'); }
      b.addEventListener('click', function () { state.page = page; render(); });
      return b;
    }

    function render() {
      var words = query.value.toLowerCase().split(/\s+/).filter(Boolean);
      var wantKind = kind.value;
      var shown = rows.filter(function (r) {
        return (!wantKind || r[F.kind] === wantKind) && words.every(function (w) { return r[F.search].indexOf(w) >= 0; });
      });
      if (state.sort !== null) {
        var field = SORT_FIELD[state.sort.key];
        var numeric = state.sort.numeric;
        var value = function (r) { var v = r[field]; return numeric ? (v === '' ? null : Number(v)) : String(v).toLowerCase(); };
        // Parts without the figure come last either way; equal values keep id order.
        shown = shown.map(function (r, i) { return [value(r), i, r]; }).sort(function (a, b) {
          if ((a[0] === null) !== (b[0] === null)) return a[0] === null ? 1 : -1;
          var order = a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0;
          return (state.ascending ? order : -order) || a[1] - b[1];
        }).map(function (x) { return x[2]; });
      }
      var pages = Math.max(1, Math.ceil(shown.length / size));
      state.page = Math.min(state.page, pages - 1);
      var body = table.tBodies[0];
      while (body.firstChild) body.removeChild(body.firstChild);
      shown.slice(state.page * size, (state.page + 1) * size).forEach(function (r) { body.appendChild(rowElement(r, root)); });
      count.value = shown.length + ' of ' + rows.length + ' shown' + (pages > 1 ? ', page ' + (state.page + 1) + ' of ' + pages : '');
      Array.prototype.forEach.call(pagers, function (nav) {
        while (nav.firstChild) nav.removeChild(nav.firstChild);
        nav.hidden = pages < 2;
        nav.appendChild(pagerButton('\u2039 previous', Math.max(0, state.page - 1), state.page === 0));
        nav.appendChild(document.createTextNode(' Page ' + (state.page + 1) + ' of ' + pages + ' '));
        nav.appendChild(pagerButton('next \u203a', Math.min(pages - 1, state.page + 1), state.page === pages - 1));
      });
    }

    form.hidden = false;
    count.value = total + ' parts; the fields search them all';
    var changed = function () { load(function () { state.page = 0; render(); }); };
    query.addEventListener('input', changed);
    kind.addEventListener('change', changed);
    form.addEventListener('submit', function (e) { e.preventDefault(); });
    var headers = table.tHead ? table.tHead.rows[0].cells : [];
    Array.prototype.forEach.call(headers, function (th) {
      if (!th.hasAttribute('data-key')) return;
      var button = element('button', { type: 'button' });
      while (th.firstChild) button.appendChild(th.firstChild);
      th.appendChild(button);
      button.addEventListener('click', function () {
        load(function () {
          var ascending = th.getAttribute('aria-sort') !== 'ascending';
          Array.prototype.forEach.call(headers, function (h) { h.removeAttribute('aria-sort'); });
          th.setAttribute('aria-sort', ascending ? 'ascending' : 'descending');
          state.sort = { key: th.getAttribute('data-key'), numeric: th.getAttribute('data-type') === 'number' };
          state.ascending = ascending;
          state.page = 0;
          render();
        });
      });
    });
  }

  var form = document.querySelector('form[data-filters]');
  var index = document.querySelector('table.parts-index');
  var paged = index && index.hasAttribute('data-chunks');
  document.querySelectorAll('table[data-sortable]').forEach(function (t) { if (!(paged && t === index)) makeSortable(t); });
  if (form && index) {
    if (paged) makePaged(form, index);
    else makeFilterable(form, index);
  }
})();

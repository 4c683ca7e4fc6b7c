// Sorting and filtering of folio tables. The pages are complete without it: every row is in the HTML.
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

  document.querySelectorAll('table[data-sortable]').forEach(makeSortable);
  var form = document.querySelector('form[data-filters]');
  var table = document.querySelector('table.parts-index');
  if (form && table) makeFilterable(form, table);
})();

/* Sorting, filtering and pages for the report's tables: plain script, no library, nothing fetched. */
(function () {
  'use strict';
  function number(text) {
    var t = text.replace(/[,\s%]/g, '');
    if (t === '' || t === '-') { return null; }
    var v = Number(t);
    return isNaN(v) ? null : v;
  }
  function setUp(box) {
    var table = box.querySelector('table');
    var tbody = table.tBodies[0];
    var heads = Array.prototype.slice.call(table.tHead.rows[0].cells);
    var rows = Array.prototype.slice.call(tbody.rows);
    var cells = rows.map(function (r) {
      return Array.prototype.map.call(r.cells, function (c) { return c.textContent; });
    });
    var textColumns = heads.map(function (h, i) { return h.classList.contains('num') ? -1 : i; })
      .filter(function (i) { return i >= 0; });
    var haystack = cells.map(function (c) {
      return textColumns.map(function (i) { return c[i]; }).join('\n').toLowerCase();
    });
    var order = rows.map(function (r, i) { return i; });
    var view = order.slice();
    var size = Number(box.getAttribute('data-page-size')) || 50;
    var page = 0;
    var filter = box.querySelector('input.filter');
    var status = box.querySelector('.status');
    var prev = box.querySelector('button.prev');
    var next = box.querySelector('button.next');

    function render() {
      var pages = Math.max(1, Math.ceil(view.length / size));
      page = Math.max(0, Math.min(page, pages - 1));
      var from = page * size;
      var shown = view.slice(from, from + size);
      var fragment = document.createDocumentFragment();
      shown.forEach(function (i) { rows[i].hidden = false; fragment.appendChild(rows[i]); });
      while (tbody.firstChild) { tbody.removeChild(tbody.firstChild); }
      tbody.appendChild(fragment);
      status.textContent = view.length === 0 ? 'no rows match'
        : 'rows ' + (from + 1).toLocaleString('en') + '-' + (from + shown.length).toLocaleString('en') + ' of '
          + view.length.toLocaleString('en') + (view.length < rows.length ? ' (filtered from ' + rows.length.toLocaleString('en') + ')' : '')
          + (pages > 1 ? ', page ' + (page + 1) + ' of ' + pages : '');
      prev.disabled = page === 0;
      next.disabled = page >= pages - 1;
      prev.hidden = next.hidden = rows.length <= size;
    }
    function applyFilter() {
      var q = filter.value.trim().toLowerCase();
      view = order.filter(function (i) { return q === '' || haystack[i].indexOf(q) >= 0; });
      page = 0;
      render();
    }
    heads.forEach(function (h, col) {
      var button = h.querySelector('button');
      button.addEventListener('click', function () {
        var descending = h.getAttribute('aria-sort') === 'ascending';
        var numeric = h.classList.contains('num');
        heads.forEach(function (o) { o.setAttribute('aria-sort', 'none'); });
        h.setAttribute('aria-sort', descending ? 'descending' : 'ascending');
        var sign = descending ? -1 : 1;
        order.sort(function (a, b) {
          var x = cells[a][col], y = cells[b][col], c;
          if (numeric) {
            var u = number(x), v = number(y);
            // Empty cells go last in either direction.
            if (u === null || v === null) { c = u === null ? (v === null ? 0 : 1) : -1; return c !== 0 ? c : a - b; }
            c = sign * (u - v);
          } else {
            c = sign * x.localeCompare(y);
          }
          return c !== 0 ? c : a - b;
        });
        applyFilter();
      });
    });
    filter.addEventListener('input', applyFilter);
    prev.addEventListener('click', function () { page--; render(); });
    next.addEventListener('click', function () { page++; render(); });
    render();
  }
  Array.prototype.forEach.call(document.querySelectorAll('div.data-table'), setUp);
}());

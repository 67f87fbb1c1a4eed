// The page's one inline script, as source text: exact ordering of decimal strings and click-to-sort ledger tables.

/**
 * Pure ordering functions (ES5, no DOM), kept apart so that tests can evaluate exactly the text
 * the browser runs. `compareCells(type, a, b)` orders two cell values of a column type:
 * - "dec": decimal strings ("1.2e-7", "-0.3", "0") in exact numeric order, decided on the
 *   digits, never through a float; a value that does not parse sorts after every number;
 * - "num": plain numbers (counts, seconds), compared as numbers;
 * - "text": UTF-16 code unit order (locale independent, so every browser agrees).
 */
export const COMPARE_JS = `
function parseDecimal(s) {
  var m = /^([+-]?)(\\d*)(?:\\.(\\d*))?(?:[eE]([+-]?\\d+))?$/.exec(s);
  if (m === null) return null;
  var whole = m[2], frac = m[3] === undefined ? "" : m[3];
  if (whole === "" && frac === "") return null;
  var digits = whole + frac;
  var exp = (m[4] === undefined ? 0 : parseInt(m[4], 10)) + whole.length;
  var lead = 0;
  while (lead < digits.length && digits.charAt(lead) === "0") lead++;
  if (lead === digits.length) return { sign: 0, exp: 0, digits: "" };
  return { sign: m[1] === "-" ? -1 : 1, exp: exp - lead, digits: digits.slice(lead).replace(/0+$/, "") };
}
function compareText(a, b) {
  return a < b ? -1 : a > b ? 1 : 0;
}
function compareDecimal(a, b) {
  var x = parseDecimal(a), y = parseDecimal(b);
  if (x === null || y === null) return x === null ? (y === null ? compareText(a, b) : 1) : -1;
  if (x.sign !== y.sign) return x.sign < y.sign ? -1 : 1;
  if (x.sign === 0) return 0;
  var c = x.exp !== y.exp ? (x.exp < y.exp ? -1 : 1) : compareText(x.digits, y.digits);
  return x.sign * c;
}
function compareCells(type, a, b) {
  if (type === "dec") return compareDecimal(a, b);
  if (type === "num") return Number(a) - Number(b);
  return compareText(a, b);
}
`;

/**
 * DOM wiring: every `table[data-sortable]` header button sorts the body rows by that column's
 * `data-v` cell values (ascending first, then toggling), ties kept in original order (`data-i`).
 * The header keeps `aria-sort`; the table records `data-sorted="<key> <direction>"`.
 */
export const WIRE_JS = `
function sortTable(table, th) {
  var heads = table.tHead.rows[0].cells;
  var col = -1;
  for (var k = 0; k < heads.length; k++) if (heads[k] === th) col = k;
  if (col < 0) return;
  var type = th.getAttribute("data-type") || "text";
  var dir = th.getAttribute("aria-sort") === "ascending" ? "descending" : "ascending";
  var sign = dir === "ascending" ? 1 : -1;
  var body = table.tBodies[0];
  var rows = Array.prototype.slice.call(body.rows);
  rows.sort(function (r, s) {
    var c = compareCells(type, r.cells[col].getAttribute("data-v"), s.cells[col].getAttribute("data-v"));
    if (c !== 0) return sign * (c < 0 ? -1 : 1);
    return Number(r.getAttribute("data-i")) - Number(s.getAttribute("data-i"));
  });
  for (var j = 0; j < heads.length; j++) if (heads[j].hasAttribute("aria-sort")) heads[j].setAttribute("aria-sort", "none");
  th.setAttribute("aria-sort", dir);
  table.setAttribute("data-sorted", th.getAttribute("data-key") + " " + dir);
  for (var i = 0; i < rows.length; i++) body.appendChild(rows[i]);
}
function wireTables() {
  var tables = document.querySelectorAll("table[data-sortable]");
  for (var t = 0; t < tables.length; t++) {
    (function (table) {
      var buttons = table.tHead.querySelectorAll("th[data-key] button");
      for (var b = 0; b < buttons.length; b++) {
        buttons[b].addEventListener("click", function (ev) {
          sortTable(table, ev.currentTarget.parentNode);
        });
      }
    })(tables[t]);
  }
  document.documentElement.setAttribute("data-ready", "");
}
wireTables();
`;

/** The script as the page inlines it (run at the end of the body, in its own scope). */
export const PAGE_SCRIPT = `(function () {\n"use strict";${COMPARE_JS}${WIRE_JS}})();\n`;

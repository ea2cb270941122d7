// The index's search box: filters the station list (and the map's dots) as the reader types. It only
// reads the page itself and fetches nothing. Without it the form stays hidden and the whole list shows.
(function () {
  'use strict';
  var form = document.querySelector('[data-find-form]');
  if (!form || !String.prototype.normalize) return;
  var input = form.querySelector('input');
  var count = form.querySelector('.find-count');
  var lang = document.documentElement.lang || 'en';
  var rules = window.Intl && Intl.PluralRules ? new Intl.PluralRules(lang) : null;
  var fold = function (text) {
    return text.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase().replace(/\s+/g, ' ');
  };
  var each = function (selector, act) { Array.prototype.forEach.call(document.querySelectorAll(selector), act); };
  var entries = [];
  each('[data-find-text]', function (el) { entries.push({ el: el, text: fold(el.getAttribute('data-find-text')) }); });
  var dots = [];
  each('[data-find-dot]', function (el) { dots.push({ el: el, text: fold(el.getAttribute('data-find-dot')) }); });

  function apply() {
    var query = fold(input.value).trim();
    var shown = 0;
    entries.forEach(function (e) {
      var hit = query === '' || e.text.indexOf(query) !== -1;
      e.el.hidden = !hit;
      if (hit) shown++;
    });
    dots.forEach(function (d) {
      d.el.classList.toggle('map-station-faded', query !== '' && d.text.indexOf(query) === -1);
    });
    // Innermost groups first, so a region sees whether any of its groups is left.
    var blocks = document.querySelectorAll('[data-find-block]');
    for (var i = blocks.length - 1; i >= 0; i--) {
      blocks[i].hidden = query !== '' && !blocks[i].querySelector('[data-find-text]:not([hidden])');
    }
    if (query === '') {
      count.textContent = '';
      return;
    }
    var form_ = rules ? rules.select(shown) : (shown === 1 ? 'one' : 'other');
    var text = count.getAttribute('data-count-' + form_) || count.getAttribute('data-count-other') || '{count}';
    count.textContent = text.replace('{count}', shown.toLocaleString(lang));
  }

  form.hidden = false;
  input.addEventListener('input', apply);
  apply();
})();

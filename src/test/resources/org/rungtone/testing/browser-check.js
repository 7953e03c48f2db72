// Runs in a harness page that holds the report in iframes of fixed widths, after everything has loaded.
// For each frame it lists the elements that reach past the page's left or right edge without a scroll box
// (an ancestor with overflow-x auto or scroll) around them, outermost only, and the images that did not
// load (naturalWidth 0), and the scroll boxes whose content is wider than they are; then it appends the
// results as JSON in a pre element with the id rungtone-browser-check.
window.addEventListener('load', function () {
  function check(frame) {
    var doc = frame.contentDocument;
    var win = frame.contentWindow;
    var width = doc.documentElement.clientWidth;
    function inScrollBox(el) {
      for (var p = el.parentElement; p && p !== doc.body; p = p.parentElement) {
        var o = win.getComputedStyle(p).overflowX;
        if (o === 'auto' || o === 'scroll') {
          return true;
        }
      }
      return false;
    }
    function describe(el) {
      var s = el.tagName.toLowerCase();
      if (el.id) {
        s += '#' + el.id;
      }
      if (typeof el.className === 'string' && el.className.trim()) {
        s += '.' + el.className.trim().split(/\s+/).join('.');
      }
      var section = el.closest('section');
      return s + (section && section.id && section !== el ? ' in section#' + section.id : '');
    }
    var over = [];
    var all = doc.body.querySelectorAll('*');
    for (var i = 0; i < all.length; i++) {
      var el = all[i];
      var r = el.getBoundingClientRect();
      if (r.width === 0 && r.height === 0) {
        continue;
      }
      if ((r.right > width + 0.5 || r.left < -0.5) && !inScrollBox(el)
          && !over.some(function (o) { return o.el.contains(el); })) {
        over.push({el: el, right: Math.round(r.right)});
      }
    }
    var broken = [];
    for (var j = 0; j < doc.images.length; j++) {
      var im = doc.images[j];
      if (!im.complete || im.naturalWidth === 0) {
        broken.push(describe(im));
      }
    }
    var scrolling = [];
    var boxes = doc.querySelectorAll('.scroll');
    for (var b = 0; b < boxes.length; b++) {
      if (boxes[b].scrollWidth > boxes[b].clientWidth + 1) {
        scrolling.push(describe(boxes[b].firstElementChild || boxes[b]));
      }
    }
    return {
      width: width,
      scrolling: scrolling,
      scrollWidth: doc.documentElement.scrollWidth,
      images: doc.images.length,
      overflowing: over.map(function (o) { return describe(o.el) + ' (right edge ' + o.right + ' px)'; }),
      brokenImages: broken
    };
  }
  var frames = document.querySelectorAll('iframe');
  var results = [];
  for (var k = 0; k < frames.length; k++) {
    results.push(check(frames[k]));
  }
  var out = document.createElement('pre');
  out.id = 'rungtone-browser-check';
  out.textContent = JSON.stringify(results);
  document.body.appendChild(out);
});

// Keeps what is typed before the page's scripts take over. Taking over (hydration) puts every field
// back to the value the server rendered, so on a slow connection the first words typed into a
// comment or a setup form were lost. Each field typed into before then is noted here, and the
// root layout puts the values back once the page is live (window.squishlineKeepTyped).
(function () {
	var typed = new Map();
	function note(e) {
		if (document.documentElement.dataset.hydrated) return;
		var el = e.target;
		if (!el || !('value' in el) || el.type === 'file' || el.type === 'hidden') return;
		typed.set(el, el.type === 'checkbox' || el.type === 'radio' ? el.checked : el.value);
	}
	document.addEventListener('input', note, true);
	document.addEventListener('change', note, true);
	window.squishlineKeepTyped = function () {
		typed.forEach(function (v, el) {
			if (!el.isConnected) return;
			var box = el.type === 'checkbox' || el.type === 'radio';
			if (box ? el.checked === v : el.value === v) return;
			if (box) el.checked = v;
			else el.value = v;
			// Bound state follows the field, as if the value had been typed now.
			el.dispatchEvent(new Event(box ? 'change' : 'input', { bubbles: true }));
		});
		typed.clear();
	};
})();

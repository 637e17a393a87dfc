// Script-injection payloads of our own collection, written after the patterns in two public
// references: the OWASP "XSS Filter Evasion Cheat Sheet"
// (https://cheatsheetseries.owasp.org/cheatsheets/XSS_Filter_Evasion_Cheat_Sheet.html) and the
// "HTML5 Security Cheatsheet" (https://html5sec.org/). Each one, if it ever ran, would call
// alert() or set window.__xss_ran; each overlay attempt carries the word OVERLAY.

const A = 'alert(1)';
const F = 'window.__xss_ran=1';

/** Tags and the attribute each one fires from. */
const handlers: [string, string][] = [
	['img src=x', 'onerror'],
	['svg', 'onload'],
	['body', 'onload'],
	['iframe', 'onload'],
	['video src=x', 'onerror'],
	['audio src=x', 'onerror'],
	['details open', 'ontoggle'],
	['input autofocus', 'onfocus'],
	['select autofocus', 'onfocus'],
	['textarea autofocus', 'onfocus'],
	['marquee', 'onstart'],
	['object data=x', 'onerror'],
	['embed src=x', 'onload'],
	['link rel=stylesheet href=x', 'onerror'],
	['style', 'onload'],
	['div tabindex=1 autofocus', 'onfocusin'],
	['a href=# autofocus', 'onfocus'],
	['button autofocus', 'onfocus'],
	['p', 'onmouseover'],
	['span', 'onclick'],
	['table background=x', 'onerror'],
	['isindex type=image src=x', 'onerror'],
	['math href=x', 'onclick'],
	['keygen autofocus', 'onfocus'],
	['form', 'onsubmit'],
	['image src=x', 'onerror'],
	['frameset', 'onload'],
	['svg><animate attributeName=x dur=1s', 'onbegin'],
	['svg><set attributeName=x to=1', 'onbegin'],
	['body', 'onpageshow']
];

const tagged = handlers.flatMap(([tag, on], i) => [
	`<${tag} ${on}=${i % 2 ? A : F}>`,
	`<${tag.toUpperCase()} ${on.toUpperCase()}="${A}">`
]);

const scripts = [
	`<script>${A}</script>`,
	`<SCRIPT>${F}</SCRIPT>`,
	`<script src=data:text/javascript,${A}></script>`,
	`<scr<script>ipt>${A}</scr</script>ipt>`,
	`<script/xss>${A}</script>`,
	`<<script>${A};//<</script>`,
	`<script>/*</script><img src=x onerror=${A}>*/</script>`,
	`"><script>${A}</script>`,
	`'><script>${F}</script>`,
	`</title><script>${A}</script>`,
	`</textarea><script>${A}</script>`,
	`</style><script>${A}</script>`,
	`<noscript><p title="</noscript><img src=x onerror=${A}>">`,
	`<template><script>${A}</script></template>`,
	`<svg><script>${A}</script></svg>`,
	`<svg><style><img src=x onerror=${A}></style></svg>`,
	`<math><mtext><table><mglyph><style><img src=x onerror=${A}>`,
	`<form><math><mtext></form><form><mglyph><style></math><img src onerror=${A}>`
];

const urls = [
	`[click](javascript:${A})`,
	`[click](JaVaScRiPt:${A})`,
	`[click](java\tscript:${A})`,
	`[click](&#106;avascript:${A})`,
	`[click](javascript&colon;${A})`,
	`[click](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)`,
	`[click](vbscript:msgbox(1))`,
	`<a href="javascript:${A}">link</a>`,
	`<a href=" javascript:${A}">link</a>`,
	`<a href="jav&#x09;ascript:${A}">link</a>`,
	`<a href="&#x6A;avascript:${A}">link</a>`,
	`<iframe src="javascript:${A}"></iframe>`,
	`<iframe srcdoc="<script>parent.${F}</script>"></iframe>`,
	`<object data="javascript:${A}"></object>`,
	`<embed src="data:image/svg+xml,<svg onload=${A}>">`,
	`<svg><a xlink:href="javascript:${A}"><text y=20>link</text></a></svg>`,
	`<svg><use href="data:image/svg+xml,<svg id=x onload=${A}>#x"/></svg>`,
	`<form action="javascript:${A}"><button>go</button></form>`,
	`<button formaction="javascript:${A}">go</button>`,
	`<meta http-equiv="refresh" content="0;url=javascript:${A}">`,
	`<base href="javascript:${A}//">`,
	`![x](x" onerror="${A})`,
	`![x](javascript:${A})`,
	`<http://a.example/"onmouseover="${A}">`,
	`[a][r]\n\n[r]: javascript:${A}`,
	`<img src="x` + '`' + `<script>${A}</script>` + '`' + `">`,
	`<img src=x:${A}(1) onerror=eval(src)>`,
	`<img """><script>${A}</script>">`,
	`<img src=# onerror="&#97;&#108;&#101;&#114;&#116;(1)">`,
	`<img src=x onerror=\\u0061lert(1)>`
];

const styles = [
	`<div style="position:fixed;inset:0;z-index:99999;background:#fff">OVERLAY Sign in again</div>`,
	`<p style="position:absolute;top:0;left:0;width:100vw;height:100vh;background:white">OVERLAY</p>`,
	`<span style="position:fixed!important;top:0;left:0;right:0;bottom:0">OVERLAY</span>`,
	`<div class="fixed inset-0 z-50 bg-paper">OVERLAY with our own utility classes</div>`,
	`<div id="main" class="sheet">OVERLAY pretending to be the page</div>`,
	`<style>body{display:none}</style>OVERLAY`,
	`<style>@import 'javascript:${A}';</style>`,
	`<div style="background:url(javascript:${A})">x</div>`,
	`<div style="width:expression(${A})">x</div>`,
	`<div style="behavior:url(x.htc)">x</div>`,
	`<link rel=stylesheet href="data:text/css,body{display:none}">`,
	`<svg width=100% height=100% style="position:fixed;top:0"><rect width=100% height=100%/></svg>OVERLAY`
];

const odd = [
	`<x onclick=${A}>click</x>`,
	`<custom-el onpointerenter=${A}>hover</custom-el>`,
	`<div data-x="1" onanimationstart=${A} style="animation:spin 1s">x</div>`,
	`<input type=image src=x onerror=${A}>`,
	`<xss contenteditable onfocus=${A} autofocus>x</xss>`,
	`<svg/onload=${A}>`,
	`<img/src=x/onerror=${A}>`,
	`<body/onload=${A}>`,
	`<iframe/src="data:text/html,<script>${A}</script>">`,
	`\u003cscript\u003e${A}\u003c/script\u003e`,
	`%3Cscript%3E${A}%3C/script%3E`,
	`&lt;script&gt;${A}&lt;/script&gt;`,
	'```html\n<script>' + A + '</script>\n```',
	'`<img src=x onerror=' + A + '>`',
	`> <img src=x onerror=${A}>`,
	`- <svg onload=${A}>`,
	`| a |\n|---|\n| <img src=x onerror=${A}> |`,
	`**<img src=x onerror=${A}>**`
];

export const PAYLOADS: string[] = [...scripts, ...tagged, ...urls, ...styles, ...odd];

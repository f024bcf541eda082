/**
 * Classes for a page body rendered by the server (pass them to ServerHtml): a link to a page
 * that does not exist (the server marks it `page-link-broken`) is struck through in the warning
 * colour and says "(no page yet)", so it reads as broken without relying on colour.
 */
export const wikiHtmlClasses =
  "[&_a.page-link-broken]:text-danger [&_a.page-link-broken]:line-through [&_a.page-link-broken]:decoration-dashed [&_a.page-link-broken]:after:text-sm [&_a.page-link-broken]:after:content-['_(no_page_yet)']";

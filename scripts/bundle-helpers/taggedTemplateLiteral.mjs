// The helper rolldown's transformer calls where it rewrites a tagged template (it does so for one
// whose raw text it must escape, such as `<\/script>`): the strings array with its frozen `raw`,
// as the language gives a tag. Its usual home, @oxc-project/runtime, is not installed here.
export default function taggedTemplateLiteral(strings, raw) {
  return Object.freeze(Object.defineProperties(strings, { raw: { value: Object.freeze(raw ?? strings.slice(0)) } }));
}

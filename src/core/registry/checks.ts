// Self-checks of the function registry: run by a test over CATALOGUE so a malformed spec fails
// the build instead of misbehaving in a cell. Each problem is one readable line.
import { inInterval } from './evaluate.ts';
import { isOptional, type FunctionSpec, type ParamSpec } from './spec.ts';

export const NAME_PATTERN = /^[A-Z][A-Z0-9]*(\.[A-Z0-9]+)*$/;
export const PARAM_PATTERN = /^[a-z][a-z0-9]*(_[a-z0-9]+)*$/;

function checkParams(spec: FunctionSpec): string[] {
  const out: string[] = [];
  const where = (p: ParamSpec, i: number) => `${spec.name}: parameter ${i + 1} (${p.name})`;
  const seen = new Set<string>();
  let sawOptional = false;
  spec.params.forEach((p, i) => {
    if (!PARAM_PATTERN.test(p.name)) out.push(`${where(p, i)}: name is not snake_case`);
    if (seen.has(p.name)) out.push(`${where(p, i)}: duplicate parameter name`);
    seen.add(p.name);
    if (isOptional(p)) sawOptional = true;
    else if (sawOptional) out.push(`${where(p, i)}: required parameter after an optional one`);
    if (!p.unit.trim()) out.push(`${where(p, i)}: unit is empty`);
    if (!p.doc.trim()) out.push(`${where(p, i)}: doc is empty`);
    const d = p.default;
    if (d === undefined) return;
    if (typeof d === 'object' && 'sameAs' in d) {
      const target = spec.params.find((q) => q.name === d.sameAs);
      if (!target || d.sameAs === p.name)
        out.push(`${where(p, i)}: default sameAs '${d.sameAs}' is not another parameter`);
      else if (isOptional(target) && typeof target.default === 'object' && 'omitted' in target.default) {
        out.push(`${where(p, i)}: default sameAs '${d.sameAs}', which may be omitted`);
      }
    } else if (typeof d === 'number' && !inInterval(d, p.domain)) {
      out.push(`${where(p, i)}: default ${d} is outside its own domain`);
    } else if (typeof d === 'boolean' && p.type !== 'boolean') {
      out.push(`${where(p, i)}: boolean default on a numeric parameter`);
    }
  });
  return out;
}

function checkExamples(spec: FunctionSpec): string[] {
  const out: string[] = [];
  if (!spec.examples.some((e) => typeof e.expect === 'number')) out.push(`${spec.name}: no numeric example`);
  if (!spec.examples.some((e) => typeof e.expect !== 'number')) out.push(`${spec.name}: no error example`);
  spec.examples.forEach((e, i) => {
    if (e.args.length > spec.params.length)
      out.push(
        `${spec.name}: example ${i + 1} has ${e.args.length} arguments, more than ${spec.params.length}`,
      );
    if (!e.note.trim()) out.push(`${spec.name}: example ${i + 1} has no note`);
    if (e.tol !== undefined && !(e.tol >= 0 && e.tol < 1))
      out.push(`${spec.name}: example ${i + 1} tolerance ${e.tol} is not in [0, 1)`);
  });
  return out;
}

/** Problems found in a list of specs; [] when all is well. */
export function checkCatalogue(list: readonly FunctionSpec[]): string[] {
  const out: string[] = [];
  const names = new Set<string>();
  for (const spec of list) {
    if (!NAME_PATTERN.test(spec.name)) out.push(`${spec.name}: name does not match ${NAME_PATTERN.source}`);
    if (names.has(spec.name)) out.push(`${spec.name}: duplicate function name`);
    names.add(spec.name);
    if (!spec.source.ref.trim()) out.push(`${spec.name}: source is empty`);
    if (!spec.summary.trim() || !spec.description.trim())
      out.push(`${spec.name}: summary or description is empty`);
    if (!spec.result.unit.trim()) out.push(`${spec.name}: result unit is empty`);
    if (spec.check && !spec.expandGuards)
      out.push(`${spec.name}: has a cross-argument check but no expandGuards`);
    out.push(...checkParams(spec), ...checkExamples(spec));
  }
  return out;
}

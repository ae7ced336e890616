/*
 * Test support (imported only by *.test.ts): walks the JSON Schema that zod derives from planInputSchema, so the
 * property tests draw inputs from the schema's own bounds rather than from a second copy of them.
 */
import fc from "fast-check";
import { z } from "zod";
import { planInputSchema, type PlanInput } from "@/lib/validations/planner";

type Node = z.core.JSONSchema.JSONSchema;

export const planInputJsonSchema: Node = z.toJSONSchema(planInputSchema, { io: "input" });

export interface NumberLeaf {
  path: string[];
  minimum: number;
  maximum: number;
  integer: boolean;
  /** The discriminator values on the way down, e.g. { "tank.dimensions": "round" }. */
  branch: Record<string, string>;
}

const asNode = (value: z.core.JSONSchema._JSONSchema | undefined): Node | null => (value && typeof value === "object" ? value : null);

function typeOf(node: Node): string | undefined {
  return Array.isArray(node.type) ? node.type[0] : node.type;
}

/** Every bounded number in the schema, with its path. */
export function numberLeaves(node: Node = planInputJsonSchema, path: string[] = [], branch: Record<string, string> = {}): NumberLeaf[] {
  const type = typeOf(node);
  if ((type === "number" || type === "integer") && node.minimum !== undefined && node.maximum !== undefined) {
    return [{ path, minimum: node.minimum, maximum: node.maximum, integer: type === "integer", branch }];
  }
  const out: NumberLeaf[] = [];
  for (const option of node.anyOf ?? []) out.push(...numberLeaves(option, path, branch));
  for (const option of node.oneOf ?? []) {
    const shape = asNode(option.properties?.shape);
    const tag = typeof shape?.const === "string" ? { ...branch, [path.join(".")]: shape.const } : branch;
    out.push(...numberLeaves(option, path, tag));
  }
  for (const [key, child] of Object.entries(node.properties ?? {})) {
    const childNode = asNode(child);
    if (childNode) out.push(...numberLeaves(childNode, [...path, key], branch));
  }
  return out;
}

function integerArbitrary(min: number, max: number): fc.Arbitrary<number> {
  if (max <= 0x7fffffff) return fc.integer({ min, max });
  return fc.oneof(fc.constantFrom(min, max), fc.integer({ min, max: 0x7fffffff }), fc.double({ min, max, noNaN: true }).map((x) => Math.min(max, Math.max(min, Math.round(x)))));
}

/** An arbitrary for any value the JSON Schema describes (the shapes planInputSchema uses). */
export function arbitraryFor(node: Node): fc.Arbitrary<unknown> {
  if (node.anyOf) return fc.oneof(...node.anyOf.map(arbitraryFor));
  if (node.oneOf) return fc.oneof(...node.oneOf.map(arbitraryFor));
  if (node.const !== undefined) return fc.constant(node.const);
  if (node.enum) return fc.constantFrom(...node.enum);
  switch (typeOf(node)) {
    case "object": {
      const model: Record<string, fc.Arbitrary<unknown>> = {};
      for (const [key, child] of Object.entries(node.properties ?? {})) {
        const childNode = asNode(child);
        if (childNode) model[key] = arbitraryFor(childNode);
      }
      return fc.record(model, { requiredKeys: node.required ?? [] });
    }
    case "number":
      return fc.double({ min: node.minimum ?? -1e9, max: node.maximum ?? 1e9, noNaN: true, noDefaultInfinity: true });
    case "integer":
      return integerArbitrary(node.minimum ?? 0, node.maximum ?? 0x7fffffff);
    case "boolean":
      return fc.boolean();
    case "string":
      return node.pattern ? fc.stringMatching(new RegExp(node.pattern)) : fc.string();
    case "null":
      return fc.constant(null);
    default:
      throw new Error(`planInput arbitrary: unsupported JSON Schema node ${JSON.stringify(node).slice(0, 80)}`);
  }
}

/** Inputs the schema accepts, drawn from its bounds (candidates failing the cross-field rules are dropped). */
export const acceptedPlanInput: fc.Arbitrary<PlanInput> = arbitraryFor(planInputJsonSchema)
  .map((candidate) => planInputSchema.safeParse(candidate))
  .filter((result): result is z.ZodSafeParseSuccess<PlanInput> => result.success)
  .map((result) => result.data);

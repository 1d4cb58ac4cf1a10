/**
 * The app's routes as the file system declares them, so a route added later is fuzzed without
 * editing the fuzz: every exported method of each `+server.ts`, every action of each
 * `+page.server.ts`, and the pages whose load reads the query string.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import ts from 'typescript';

const HTTP_METHODS = new Set(['GET', 'POST', 'PUT', 'PATCH', 'DELETE']);

/** One thing to fuzz: a method of an endpoint, an action of a page, or a page's load. */
export type Target =
	| { kind: 'endpoint'; routeId: string; method: string }
	| { kind: 'action'; routeId: string; action: string }
	| { kind: 'load'; routeId: string };

export function targetName(target: Target): string {
	if (target.kind === 'endpoint') return `${target.method} ${target.routeId}`;
	if (target.kind === 'action')
		return `POST ${target.routeId}${target.action === 'default' ? '' : `?/${target.action}`}`;
	return `GET ${target.routeId} (page)`;
}

/** SvelteKit's route id of a route file: its folder under src/routes, groups kept. */
function routeIdOf(routesDir: string, file: string): string {
	const folder = relative(routesDir, file).split(sep).slice(0, -1).join('/');
	return `/${folder}`;
}

/** Each exported name with what it is set to: an initializer, a function, or nothing known. */
function exportedNames(source: ts.SourceFile): Map<string, ts.Node | undefined> {
	const names = new Map<string, ts.Node | undefined>();
	const isExported = (node: ts.Node) =>
		ts.canHaveModifiers(node) &&
		(ts.getModifiers(node) ?? []).some((m) => m.kind === ts.SyntaxKind.ExportKeyword);
	for (const statement of source.statements) {
		if (ts.isVariableStatement(statement) && isExported(statement)) {
			for (const declaration of statement.declarationList.declarations)
				if (ts.isIdentifier(declaration.name))
					names.set(declaration.name.text, declaration.initializer);
		} else if (ts.isFunctionDeclaration(statement) && statement.name && isExported(statement)) {
			names.set(statement.name.text, statement);
		} else if (
			ts.isExportDeclaration(statement) &&
			statement.exportClause &&
			ts.isNamedExports(statement.exportClause)
		) {
			for (const element of statement.exportClause.elements)
				names.set(element.name.text, undefined);
		}
	}
	return names;
}

/** The keys of the object literal `actions` is set to, through `satisfies` or `as`. */
function actionNames(initializer: ts.Node | undefined, file: string): string[] {
	let node = initializer;
	while (node && (ts.isSatisfiesExpression(node) || ts.isAsExpression(node)))
		node = node.expression;
	if (!node || !ts.isObjectLiteralExpression(node))
		throw new Error(`${file}: \`actions\` is not an object literal the fuzz can read.`);
	return node.properties.map((property) => {
		const name = property.name;
		if (name && (ts.isIdentifier(name) || ts.isStringLiteral(name))) return name.text;
		throw new Error(`${file}: an action with a computed name.`);
	});
}

/** Whether a load takes the request's address, and with it the query string, as input. */
function readsUrl(load: ts.Node | undefined): boolean {
	if (!load || !(ts.isFunctionLike(load) && 'parameters' in load)) return false;
	const [event] = load.parameters;
	if (!event) return false;
	if (ts.isObjectBindingPattern(event.name))
		return event.name.elements.some(
			(element) => (element.propertyName ?? element.name).getText() === 'url'
		);
	return load.getText().includes(`${event.name.getText()}.url`);
}

function routeFiles(dir: string, name: string): string[] {
	return readdirSync(dir, { recursive: true, encoding: 'utf8' })
		.filter((path) => path.split(sep).at(-1) === name)
		.map((path) => join(dir, path))
		.sort();
}

function parse(file: string): ts.SourceFile {
	return ts.createSourceFile(file, readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true);
}

export function discoverTargets(routesDir = 'src/routes'): Target[] {
	const targets: Target[] = [];
	for (const file of routeFiles(routesDir, '+server.ts')) {
		const source = parse(file);
		const routeId = routeIdOf(routesDir, file);
		for (const name of exportedNames(source).keys())
			if (HTTP_METHODS.has(name)) targets.push({ kind: 'endpoint', routeId, method: name });
	}
	for (const file of routeFiles(routesDir, '+page.server.ts')) {
		const source = parse(file);
		const routeId = routeIdOf(routesDir, file);
		const exported = exportedNames(source);
		if (exported.has('actions'))
			for (const action of actionNames(exported.get('actions'), file))
				targets.push({ kind: 'action', routeId, action });
		if (readsUrl(exported.get('load'))) targets.push({ kind: 'load', routeId });
	}
	return targets;
}

/** The parameter names of a route id, `[id]` and `[[optional]]` alike. */
export function routeParams(routeId: string): string[] {
	return [...routeId.matchAll(/\[{1,2}(?:\.\.\.)?(\w+)(?:=\w+)?\]{1,2}/g)].map((m) => m[1]!);
}

/** The path of a route id with its groups dropped and its parameters filled in. */
export function routePath(routeId: string, params: Record<string, string>): string {
	const path = routeId
		.split('/')
		.filter((segment) => !/^\(.+\)$/.test(segment))
		.join('/')
		.replace(/\[{1,2}(?:\.\.\.)?(\w+)(?:=\w+)?\]{1,2}/g, (_, name: string) => {
			const value = params[name];
			if (value === undefined) throw new Error(`No value for [${name}] of ${routeId}.`);
			return value;
		});
	return path || '/';
}

// What the pure core's types cannot catch: `node scripts/check-pure-calls.mjs [root]`.
//   The pure core (the files of tsconfig.core.json) compiles with no platform at all, so window, fetch or process
//   already fail there. The clock and randomness are different: Date and Math are plain ECMAScript. This reads
//   the core with the TypeScript compiler (its syntax tree and symbols, so comments, strings and a local variable
//   that happens to be called `crypto` are not mistaken for the real thing) and reports:
//     no-clock       Date.now(), new Date() or Date() without an argument, performance, Temporal
//     no-randomness  Math.random(), crypto
//   The time and random numbers are passed in instead (see log/records.ts `now`, physics/createRandom.ts).
// Prints one line per finding (file:line:column rule: message) and exits 1 when there is any.
import ts from 'typescript';
import { dirname, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Globals that read the clock or draw randomness wherever they are touched, by rule. */
const WHOLE_GLOBALS = { performance: 'no-clock', Temporal: 'no-clock', crypto: 'no-randomness' };

/**
 * Checks the files of a tsconfig (by default tsconfig.core.json under root); returns the findings, file paths
 * relative to root with forward slashes.
 */
export function checkPureCalls(root = process.cwd(), project = 'tsconfig.core.json') {
  const configPath = resolve(root, project);
  const read = ts.readConfigFile(configPath, ts.sys.readFile);
  if (read.error) throw new Error(ts.flattenDiagnosticMessageText(read.error.messageText, '\n'));
  const parsed = ts.parseJsonConfigFileContent(read.config, ts.sys, dirname(configPath), undefined, configPath);
  if (parsed.fileNames.length === 0) throw new Error(`${project} lists no files: nothing would be checked`);
  const program = ts.createProgram({ rootNames: parsed.fileNames, options: parsed.options });
  const checker = program.getTypeChecker();
  const own = new Set(parsed.fileNames.map((f) => resolve(f)));
  const findings = [];

  /** True when the name means the platform's global (declared only in a .d.ts, or nowhere), not something of ours. */
  const isGlobal = (id) => {
    const symbol = checker.getSymbolAtLocation(id);
    return !symbol || !symbol.declarations?.length || symbol.declarations.every((d) => d.getSourceFile().isDeclarationFile);
  };
  /** The global an expression names: `Date`, or `globalThis.Date`; undefined for anything else. */
  const globalName = (expr) => {
    if (ts.isIdentifier(expr)) return isGlobal(expr) ? expr.text : undefined;
    if (ts.isPropertyAccessExpression(expr) && ts.isIdentifier(expr.expression) && expr.expression.text === 'globalThis' && isGlobal(expr.expression)) {
      return expr.name.text;
    }
    return undefined;
  };
  /** An identifier that refers to a variable (not a property name, a declaration's name or a member of something). */
  const isReference = (id) => {
    const p = id.parent;
    if (ts.isPropertyAccessExpression(p) && p.name === id) return false;
    if (ts.isQualifiedName(p) && p.right === id) return false;
    if ((ts.isImportSpecifier(p) || ts.isExportSpecifier(p) || ts.isBindingElement(p)) && p.propertyName === id) return false;
    if (p.name === id && !ts.isShorthandPropertyAssignment(p)) return false;
    return true;
  };

  for (const sourceFile of program.getSourceFiles()) {
    if (!own.has(resolve(sourceFile.fileName))) continue;
    const file = relative(root, sourceFile.fileName).split(sep).join('/');
    const report = (node, rule, message) => {
      const { line, character } = sourceFile.getLineAndCharacterOfPosition(node.getStart(sourceFile));
      findings.push({ file, line: line + 1, column: character + 1, rule, message });
    };
    const visit = (node) => {
      if (ts.isPropertyAccessExpression(node)) {
        const owner = globalName(node.expression);
        if (owner === 'Date' && node.name.text === 'now') report(node, 'no-clock', 'Date.now() reads the clock; pass the time in');
        if (owner === 'Math' && node.name.text === 'random') report(node, 'no-randomness', 'Math.random() draws unseeded numbers; pass a random source in');
        if (ts.isIdentifier(node.expression) && node.expression.text === 'globalThis' && node.name.text in WHOLE_GLOBALS && isGlobal(node.expression)) {
          report(node, WHOLE_GLOBALS[node.name.text], `${node.name.text} is the platform's; pass what it gives in`);
        }
      } else if (ts.isNewExpression(node) && globalName(node.expression) === 'Date' && !node.arguments?.length) {
        report(node, 'no-clock', 'new Date() without an argument reads the clock; pass the time in');
      } else if (ts.isCallExpression(node) && globalName(node.expression) === 'Date') {
        report(node, 'no-clock', 'Date() called as a function reads the clock; pass the time in');
      } else if (ts.isIdentifier(node) && Object.hasOwn(WHOLE_GLOBALS, node.text) && isReference(node) && isGlobal(node)) {
        report(node, WHOLE_GLOBALS[node.text], `${node.text} is the platform's; pass what it gives in`);
      }
      ts.forEachChild(node, visit);
    };
    visit(sourceFile);
  }
  return { files: own.size, findings };
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const root = resolve(process.argv[2] ?? '.');
  const { files, findings } = checkPureCalls(root);
  for (const f of findings) console.error(`${f.file}:${f.line}:${f.column} ${f.rule}: ${f.message}`);
  if (findings.length > 0) {
    console.error(`pure core: ${findings.length} clock or randomness use(s) in ${files} files`);
    process.exit(1);
  }
  console.log(`pure core: no clock or randomness in ${files} files`);
}

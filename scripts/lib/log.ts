const colours: Record<string, string> = { db: "36", mail: "35", s3: "33", app: "32", test: "34", build: "90" };

export function log(tag: string, message: string) {
  const colour = colours[tag] ?? "0";
  const prefix = process.stdout.isTTY ? `\x1b[${colour}m[${tag}]\x1b[0m` : `[${tag}]`;
  console.log(`${prefix} ${message}`);
}

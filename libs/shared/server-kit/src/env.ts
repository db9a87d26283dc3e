/** A setting the process cannot run without; fails at start-up with the variable's name. */
export function requiredEnv(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`Environment variable ${name} is not set`);
  return value;
}

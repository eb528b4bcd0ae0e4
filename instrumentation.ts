// Runs once when a server instance starts: a missing or malformed setting stops it at once with the
// variable's name, rather than failing on the first request that needs it.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { env, EnvError } = await import("@/lib/env");
  try {
    env();
  } catch (error) {
    if (error instanceof EnvError) {
      console.error(error.message);
      process.exit(1);
    }
    throw error;
  }
}

export async function register() {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { startServer } = await import("./server/startup");
    await startServer();
  }
}

import { z } from "zod";

// The page policy allows no eval; zod probes for it with `new Function` on first use, which
// Chromium reports as a policy violation even though zod catches it. Jitless skips the probe.
z.config({ jitless: true });

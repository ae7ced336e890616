"use client";
import { createAuthClient } from "better-auth/react";

// Same-origin: the client talks to /api/auth on whichever host served the page.
export const authClient = createAuthClient();

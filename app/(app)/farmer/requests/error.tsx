"use client";
import { ErrorState } from "@/components/ui/error-state";

export default ErrorState;

import { z } from "zod";

// Shared by the PIN form in the browser and the server.
export const pinSchema = z
  .string({ message: "Enter a PIN of 4 to 8 digits." })
  .regex(/^\d{4,8}$/, "A PIN is 4 to 8 digits, nothing else.");

import "server-only";
import { AppError } from "@/lib/errors";
import { photoErrorCodes } from "./contract";

export const PHOTO_REFUSED = photoErrorCodes.refused;

/** A photo we will not keep, with a message the volunteer can act on. Answered as 400. */
export class PhotoRefusal extends AppError {
  constructor(message: string) {
    super(400, PHOTO_REFUSED, message);
    this.name = "PhotoRefusal";
  }
}

export function isPhotoRefusal(error: unknown): error is PhotoRefusal {
  return error instanceof PhotoRefusal;
}

export function megabytes(bytes: number): string {
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

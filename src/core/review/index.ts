/** Review in git: what changed between two sidecar versions, and a picture of the picks. */
export * from './compare';
export * from './describe';

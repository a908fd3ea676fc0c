import express from 'express';

/**
 * Reads a JSON body. Mounted per router, after the origin, sign-in and permission checks, so
 * nobody can make the server parse a body they may not send (an anonymous 1 MB JSON costs nothing).
 */
export const jsonBody = express.json({ limit: '1mb' });

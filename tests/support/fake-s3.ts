/**
 * A small stand-in for S3-compatible object storage, for tests: a node:http server on 127.0.0.1
 * (a free port) that keeps objects in memory and answers path-style PutObject, GetObject and
 * DeleteObject in the S3 REST format (Amazon S3 API Reference: PutObject, GetObject, DeleteObject,
 * and "Error responses" for the XML error body with <Code>, <Message>, <Resource>, <RequestId>).
 *
 * Why our own code: no maintained in-process S3 fake on the npm registry fits. `npm view s3rver`
 * gives 3.7.1 as its latest version, on dependencies several majors old (koa 2, busboy 0.3,
 * fast-xml-parser 3, fs-extra 8); `npm view s3rver time` lists no usable publish dates (the
 * entries are out of version order), and from memory 3.7.1 dates from 2021. It also keeps objects
 * on disk and does not hand the requests to the test. aws-sdk-client-mock (4.1.0) replaces the
 * client's send() and so skips the very parts this fake exists to exercise: the HTTP requests,
 * their signatures and the XML error answers.
 *
 * What it checks on every request (AWS Signature Version 4, Amazon S3 API Reference,
 * "Authenticating Requests (AWS Signature Version 4)", header-based, payload in a single chunk):
 * - an Authorization header `AWS4-HMAC-SHA256 Credential=<key id>/<date>/<region>/s3/aws4_request,
 *   SignedHeaders=..., Signature=...` (none: 403 AccessDenied; malformed: 400 AuthorizationHeaderMalformed);
 * - the access key id is the fake's (403 InvalidAccessKeyId), the scope's date matches x-amz-date,
 *   its region is the fake's and its service is s3;
 * - x-amz-date lies within 15 minutes of the clock (403 RequestTimeTooSkewed);
 * - the full signature, recomputed with the fake's secret over the canonical request
 *   (403 SignatureDoesNotMatch); host, x-amz-date and x-amz-content-sha256 must be signed;
 * - x-amz-content-sha256 equals the SHA-256 of the body received, or is UNSIGNED-PAYLOAD
 *   (400 XAmzContentSHA256Mismatch); x-amz-checksum-crc32, when sent, equals the body's CRC32 (400 BadDigest).
 * What it does not do: chunked (STREAMING-*) uploads, presigned URLs, virtual-hosted addressing,
 * multipart uploads, ranges, conditional requests, listing, ACLs or policies: anything other than
 * the three object calls gets 501 NotImplemented.
 */
import { createHash, createHmac, randomUUID, timingSafeEqual } from 'node:crypto';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { crc32 } from 'node:zlib';

/** One stored object. */
export interface FakeS3Object {
  body: Buffer;
  contentType: string | undefined;
  /** Quoted MD5 of the body, as S3 gives for a single-request upload. */
  etag: string;
  /** Base64 CRC32 of the body, when the upload carried one. */
  checksumCrc32: string | undefined;
  lastModified: Date;
}

/** What the fake saw of one request and how it answered. */
export interface FakeS3Request {
  method: string;
  /** The raw path and query, as sent. */
  url: string;
  bucket: string | undefined;
  /** The decoded object key, when the path names one. */
  key: string | undefined;
  /** Access key id named in the Authorization header, if any. */
  accessKeyId: string | undefined;
  /** The request's Content-Type header. */
  contentType: string | undefined;
  bodyBytes: number;
  status: number;
  /** The S3 error code answered, when it was an error. */
  errorCode: string | undefined;
}

/** A planned misbehaviour for matching (correctly signed) requests, to test the driver's error paths. */
export interface FakeS3Fault {
  method: 'GET' | 'PUT' | 'DELETE';
  /** Object key (or pattern of keys) the fault applies to; every key when omitted. */
  key?: string | RegExp;
  /** How many matching requests it applies to (default: every one). */
  times?: number;
  /**
   * Answer with this status and S3 error code (no code: an empty body); 'stall': never answer;
   * 'corrupt' (GET only): send the object with its first byte changed but its stored checksum.
   */
  reply: { status: number; code?: string } | 'stall' | 'corrupt';
}

export interface FakeS3Options {
  bucket?: string;
  region?: string;
  accessKeyId?: string;
  secretAccessKey?: string;
}

export interface FakeS3 {
  /** `http://127.0.0.1:<port>`. */
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** Stored objects by key. */
  objects: Map<string, FakeS3Object>;
  /** Every request, in order of arrival. */
  requests: FakeS3Request[];
  /** Faults to apply; the first that matches a request is used. */
  faults: FakeS3Fault[];
  /** Forgets objects, requests and faults. */
  reset(): void;
  close(): Promise<void>;
}

const XML_HEADER = '<?xml version="1.0" encoding="UTF-8"?>\n';
const EMPTY_SHA256 = createHash('sha256').update('').digest('hex');
const MAX_SKEW_MS = 15 * 60 * 1000;

const ERROR_MESSAGES: Record<string, string> = {
  AccessDenied: 'Access Denied',
  AuthorizationHeaderMalformed: 'The authorization header is malformed.',
  InvalidAccessKeyId: 'The AWS Access Key Id you provided does not exist in our records.',
  SignatureDoesNotMatch: 'The request signature we calculated does not match the signature you provided. Check your key and signing method.',
  RequestTimeTooSkewed: 'The difference between the request time and the current time is too large.',
  XAmzContentSHA256Mismatch: 'The provided \'x-amz-content-sha256\' header does not match what was computed.',
  BadDigest: 'The CRC32 you specified did not match the calculated checksum.',
  NoSuchBucket: 'The specified bucket does not exist',
  NoSuchKey: 'The specified key does not exist.',
  NotImplemented: 'A header or query you provided implies functionality that is not implemented.',
  InternalError: 'We encountered an internal error. Please try again.',
};

function escapeXml(text: string): string {
  return text.replace(/[<>&'"]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '\'': '&apos;', '"': '&quot;' })[c]!);
}

/** Percent-encoding as SigV4 wants it: every byte but A-Z a-z 0-9 - _ . ~ (RFC 3986 unreserved). */
function uriEncode(text: string): string {
  return encodeURIComponent(text).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}

/** The parts of a request that Signature Version 4 covers. */
export interface SignableRequest {
  method: string;
  /** The path exactly as sent (S3 signs it as sent: encoded once, not normalized). */
  path: string;
  /** The raw query string, without `?`. */
  query: string;
  /** Header values by lower-case name. */
  headers: Record<string, string | undefined>;
  /** Lower-case names, in the order given in SignedHeaders. */
  signedHeaders: string[];
  /** The x-amz-content-sha256 value. */
  payloadHash: string;
}

/** The canonical request of SigV4: method, URI, sorted query, signed headers, their names, payload hash. */
export function canonicalRequest(req: SignableRequest): string {
  const pairs = req.query === ''
    ? []
    : req.query.split('&').map((part) => {
      const eq = part.indexOf('=');
      const [name, value] = eq < 0 ? [part, ''] : [part.slice(0, eq), part.slice(eq + 1)];
      const decode = (s: string) => decodeURIComponent(s.replace(/\+/g, ' '));
      return [uriEncode(decode(name)), uriEncode(decode(value))] as const;
    });
  pairs.sort(([a, av], [b, bv]) => (a < b ? -1 : a > b ? 1 : av < bv ? -1 : av > bv ? 1 : 0));
  const headerLines = req.signedHeaders.map((name) => `${name}:${(req.headers[name] ?? '').trim().replace(/\s+/g, ' ')}\n`).join('');
  return [
    req.method,
    req.path || '/',
    pairs.map(([k, v]) => `${k}=${v}`).join('&'),
    headerLines,
    req.signedHeaders.join(';'),
    req.payloadHash,
  ].join('\n');
}

/** The hex SigV4 signature of a request: HMAC chain over date, region, service, then the string to sign. */
export function sigV4Signature(req: SignableRequest, secretAccessKey: string, amzDate: string, region: string, service = 's3'): string {
  const date = amzDate.slice(0, 8);
  const scope = `${date}/${region}/${service}/aws4_request`;
  const stringToSign = ['AWS4-HMAC-SHA256', amzDate, scope, createHash('sha256').update(canonicalRequest(req)).digest('hex')].join('\n');
  const hmac = (key: Buffer | string, data: string) => createHmac('sha256', key).update(data).digest();
  const signingKey = hmac(hmac(hmac(hmac(`AWS4${secretAccessKey}`, date), region), service), 'aws4_request');
  return createHmac('sha256', signingKey).update(stringToSign).digest('hex');
}

/** `20130524T000000Z` -> its time in ms, NaN when malformed. */
function parseAmzDate(value: string): number {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(value);
  return m ? Date.UTC(+m[1]!, +m[2]! - 1, +m[3]!, +m[4]!, +m[5]!, +m[6]!) : Number.NaN;
}

class S3Failure extends Error {
  constructor(readonly status: number, readonly code: string) {
    super(code);
  }
}

function headerValue(req: IncomingMessage, name: string): string | undefined {
  const value = req.headers[name];
  return Array.isArray(value) ? value.join(',') : value;
}

/** Throws S3Failure unless the request is signed by the expected key pair; notes the key id named in the record. */
function checkSignature(req: IncomingMessage, body: Buffer, expected: Required<FakeS3Options>, record: FakeS3Request): void {
  const authorization = headerValue(req, 'authorization');
  if (!authorization) throw new S3Failure(403, 'AccessDenied');
  const m = /^AWS4-HMAC-SHA256 Credential=([^/,\s]+)\/(\d{8})\/([^/,\s]+)\/([^/,\s]+)\/aws4_request,\s*SignedHeaders=([a-z0-9;-]+),\s*Signature=([0-9a-f]{64})$/.exec(authorization);
  if (!m) throw new S3Failure(400, 'AuthorizationHeaderMalformed');
  const [, keyId, scopeDate, region, service, signedHeaderList, signature] = m as unknown as string[];
  record.accessKeyId = keyId;
  if (keyId !== expected.accessKeyId) throw new S3Failure(403, 'InvalidAccessKeyId');
  const amzDate = headerValue(req, 'x-amz-date') ?? '';
  const time = parseAmzDate(amzDate);
  if (Number.isNaN(time) || scopeDate !== amzDate.slice(0, 8) || region !== expected.region || service !== 's3') {
    throw new S3Failure(400, 'AuthorizationHeaderMalformed');
  }
  if (Math.abs(Date.now() - time) > MAX_SKEW_MS) throw new S3Failure(403, 'RequestTimeTooSkewed');
  const signedHeaders = signedHeaderList!.split(';');
  const payloadHash = headerValue(req, 'x-amz-content-sha256');
  if (!payloadHash || !['host', 'x-amz-date', 'x-amz-content-sha256'].every((h) => signedHeaders.includes(h))) {
    throw new S3Failure(403, 'AccessDenied');
  }
  if (payloadHash.startsWith('STREAMING-')) throw new S3Failure(501, 'NotImplemented');
  const url = req.url ?? '/';
  const q = url.indexOf('?');
  const headers = Object.fromEntries(signedHeaders.map((h) => [h, headerValue(req, h)]));
  const wanted = sigV4Signature({ method: req.method ?? 'GET', path: q < 0 ? url : url.slice(0, q), query: q < 0 ? '' : url.slice(q + 1), headers, signedHeaders, payloadHash }, expected.secretAccessKey, amzDate, region!);
  if (!timingSafeEqual(Buffer.from(wanted), Buffer.from(signature!))) throw new S3Failure(403, 'SignatureDoesNotMatch');
  if (payloadHash !== 'UNSIGNED-PAYLOAD' && payloadHash !== createHash('sha256').update(body).digest('hex')) {
    throw new S3Failure(400, 'XAmzContentSHA256Mismatch');
  }
}

function sendError(res: ServerResponse, status: number, code: string | undefined, resource: string): void {
  res.statusCode = status;
  res.setHeader('x-amz-request-id', randomUUID().replace(/-/g, '').slice(0, 16).toUpperCase());
  if (!code) {
    res.end();
    return;
  }
  res.setHeader('content-type', 'application/xml');
  res.end(`${XML_HEADER}<Error><Code>${escapeXml(code)}</Code><Message>${escapeXml(ERROR_MESSAGES[code] ?? code)}</Message><Resource>${escapeXml(resource)}</Resource><RequestId>fake</RequestId></Error>`);
}

/** Starts the fake on 127.0.0.1 and a free port. Close it in afterAll. */
export async function startFakeS3(options: FakeS3Options = {}): Promise<FakeS3> {
  const settings: Required<FakeS3Options> = {
    bucket: options.bucket ?? 'gnomon-test-photos',
    region: options.region ?? 'us-east-1',
    accessKeyId: options.accessKeyId ?? 'GNOMONTESTKEYID00001',
    secretAccessKey: options.secretAccessKey ?? 'gnomon-test-secret-access-key-0000000000',
  };
  const objects = new Map<string, FakeS3Object>();
  const requests: FakeS3Request[] = [];
  const faults: FakeS3Fault[] = [];

  const keyMatches = (wanted: FakeS3Fault['key'], key: string | undefined) =>
    wanted === undefined || (typeof wanted === 'string' ? wanted === key : key !== undefined && wanted.test(key));
  const takeFault = (method: string, key: string | undefined): FakeS3Fault | undefined => {
    const index = faults.findIndex((f) => f.method === method && keyMatches(f.key, key) && (f.times === undefined || f.times > 0));
    if (index < 0) return undefined;
    const fault = faults[index]!;
    if (fault.times !== undefined) fault.times -= 1;
    return fault;
  };

  const handle = (req: IncomingMessage, res: ServerResponse, body: Buffer) => {
    const url = req.url ?? '/';
    const path = url.split('?')[0]!;
    const [, rawBucket, ...rawKey] = path.split('/');
    const bucket = rawBucket ? decodeURIComponent(rawBucket) : undefined;
    const key = rawKey.length > 0 && rawKey.join('/') !== '' ? rawKey.map(decodeURIComponent).join('/') : undefined;
    const record: FakeS3Request = {
      method: req.method ?? '', url, bucket, key, accessKeyId: undefined,
      contentType: headerValue(req, 'content-type'), bodyBytes: body.length, status: 0, errorCode: undefined,
    };
    requests.push(record);
    const fail = (status: number, code: string | undefined) => {
      record.status = status;
      record.errorCode = code;
      sendError(res, status, code, path);
    };
    try {
      checkSignature(req, body, settings, record);
    } catch (error) {
      if (error instanceof S3Failure) return fail(error.status, error.code);
      throw error;
    }
    if (bucket !== settings.bucket) return fail(404, 'NoSuchBucket');
    if (key === undefined || !['GET', 'PUT', 'DELETE'].includes(record.method)) return fail(501, 'NotImplemented');
    const fault = takeFault(record.method, key);
    if (fault?.reply === 'stall') {
      record.status = -1;
      return; // never answered; the connection is dropped on close()
    }
    if (fault && fault.reply !== 'corrupt') return fail(fault.reply.status, fault.reply.code);

    if (record.method === 'PUT') {
      const sentCrc = headerValue(req, 'x-amz-checksum-crc32');
      const crc = Buffer.alloc(4);
      crc.writeUInt32BE(crc32(body) >>> 0);
      if (sentCrc !== undefined && sentCrc !== crc.toString('base64')) return fail(400, 'BadDigest');
      const etag = `"${createHash('md5').update(body).digest('hex')}"`;
      objects.set(key, { body, contentType: record.contentType, etag, checksumCrc32: sentCrc, lastModified: new Date() });
      record.status = 200;
      res.statusCode = 200;
      res.setHeader('etag', etag);
      if (sentCrc) res.setHeader('x-amz-checksum-crc32', sentCrc);
      res.end();
      return;
    }
    if (record.method === 'GET') {
      const object = objects.get(key);
      if (!object) return fail(404, 'NoSuchKey');
      record.status = 200;
      res.statusCode = 200;
      res.setHeader('content-length', object.body.length);
      res.setHeader('content-type', object.contentType ?? 'binary/octet-stream');
      res.setHeader('etag', object.etag);
      res.setHeader('last-modified', object.lastModified.toUTCString());
      if (object.checksumCrc32 && headerValue(req, 'x-amz-checksum-mode') === 'ENABLED') {
        res.setHeader('x-amz-checksum-crc32', object.checksumCrc32);
        res.setHeader('x-amz-checksum-type', 'FULL_OBJECT');
      }
      const sent = Buffer.from(object.body);
      if (fault?.reply === 'corrupt' && sent.length > 0) sent[0] = sent[0]! ^ 0xff;
      res.end(sent);
      return;
    }
    // DELETE: S3 answers 204 whether or not the key held anything.
    objects.delete(key);
    record.status = 204;
    res.statusCode = 204;
    res.end();
  };

  const server: Server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      try {
        handle(req, res, Buffer.concat(chunks));
      } catch (error) {
        console.error('fake S3 failed:', error);
        sendError(res, 500, 'InternalError', req.url ?? '/');
      }
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const { port } = server.address() as AddressInfo;

  return {
    endpoint: `http://127.0.0.1:${port}`,
    ...settings,
    objects,
    requests,
    faults,
    reset() {
      objects.clear();
      requests.length = 0;
      faults.length = 0;
    },
    close() {
      return new Promise<void>((resolve, reject) => {
        server.close((error) => (error ? reject(error) : resolve()));
        server.closeAllConnections();
      });
    },
  };
}

export { EMPTY_SHA256 };

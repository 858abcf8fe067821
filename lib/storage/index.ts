// The fake S3 server is imported from "./fake-s3" directly, so route handlers never bundle it.
export {
  DEFAULT_S3_BUCKET,
  deleteObject,
  ensureBucket,
  getObject,
  getStorageConfig,
  isObjectNotFound,
  ObjectNotFoundError,
  putObject,
  type StorageConfig,
} from "./object-store";
export {
  checkPdfUpload,
  detectExecutable,
  MAX_UPLOAD_BYTES,
  pdfFileName,
  sanitizeFileName,
  sha256Hex,
  sniffPdf,
  type ExecutableKind,
  type PdfUploadCheck,
} from "./files";

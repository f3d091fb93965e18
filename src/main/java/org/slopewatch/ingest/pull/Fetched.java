package org.slopewatch.ingest.pull;

/** What one HTTP fetch came to, before anything is read from the body. */
sealed interface Fetched permits Fetched.Body, Fetched.NotModified, Fetched.Failed {

    /**
     * A 200 with the whole body, read to its end and within the limit.
     *
     * @param etag         the {@code ETag} the server sent, or null
     * @param lastModified the {@code Last-Modified} the server sent, as written, or null
     */
    record Body(int status, byte[] bytes, String charset, String etag, String lastModified) implements Fetched {
    }

    /** A 304: the publication is what was read last time (RFC 9110, section 15.4.5). */
    record NotModified(int status) implements Fetched {
    }

    /**
     * No publication: an error status, a body too long or cut short, a time-out, a refused connection.
     *
     * @param status    the status code, or null when no answer came
     * @param retryable whether another try may do better (5xx, 429, network); another 4xx will not
     */
    record Failed(Integer status, boolean retryable, String reason) implements Fetched {
    }
}

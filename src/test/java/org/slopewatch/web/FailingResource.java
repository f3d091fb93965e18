package org.slopewatch.web;

import jakarta.ws.rs.GET;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.core.MediaType;

/**
 * A route of the test application only (it is compiled with the tests, so the daemon never has
 * it), failing the way a bug would, with a message that must stay in the log: ErrorContractTest
 * checks that the answer is a generic 500 problem document that repeats none of it.
 */
@Path("/api/test-only/failure")
public class FailingResource {

    /** Stands for anything an exception message could carry that a client must not see: a password, a journal URL. */
    static final String SECRET = "jdbc:postgresql://db.desk.invalid/journal?password=hunter2-not-for-clients";

    @GET
    @Produces(MediaType.APPLICATION_JSON)
    public String fail() {
        throw new IllegalStateException("the journal at " + SECRET + " did not answer");
    }
}

package org.exhale.simulation;

/**
 * A legal case whose physics this model cannot carry to the end: the integrator's step fell to the
 * resolution of the clock or the state stopped being finite. The message names the physical
 * quantity, the corner and the time; the command line prints it on one line and exits with code 2
 * (see docs/errors.md), never as an internal error.
 */
public class OutOfReach extends RuntimeException {
    public OutOfReach(String message, Throwable cause) {
        super(message, cause);
    }
}

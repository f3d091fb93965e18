package org.slopewatch.testsupport;

import net.jqwik.api.lifecycle.AroundPropertyHook;
import net.jqwik.api.lifecycle.PropagationMode;
import net.jqwik.api.lifecycle.PropertyExecutionResult;
import net.jqwik.api.lifecycle.PropertyExecutor;
import net.jqwik.api.lifecycle.PropertyLifecycleContext;

/**
 * Lets a long run give the fuzz properties more tries than the suite's: with {@code -Dfuzz.tries=N}
 * every property carrying this hook ({@code @AddLifecycleHook(FuzzTries.class)}) runs N tries
 * instead of the number in its annotation, which stays what CI runs.
 */
public final class FuzzTries implements AroundPropertyHook {

    static final String PROPERTY = "fuzz.tries";

    /** Registered on a test class, it applies to each property of the class. */
    @Override
    public PropagationMode propagateTo() {
        return PropagationMode.ALL_DESCENDANTS;
    }

    @Override
    public PropertyExecutionResult aroundProperty(PropertyLifecycleContext context, PropertyExecutor property) {
        String tries = System.getProperty(PROPERTY);
        if (tries != null && !tries.isBlank()) {
            context.attributes().setTries(Integer.parseInt(tries.strip()));
        }
        return property.execute();
    }
}

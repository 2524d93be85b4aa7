package org.viewgain.engine;

/** Receives progress of a run: finished work units out of the total. Called from worker threads. */
public interface Progress {
    Progress NONE = (done, total) -> { };

    void update(long done, long total);
}

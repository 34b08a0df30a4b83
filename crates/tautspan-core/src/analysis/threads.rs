//! How many threads an analysis may use. The analysis shares its
//! independent work (the load path of each mass) among the machine's cores;
//! a caller that must keep a core for itself (the app, whose interface
//! thread draws while its worker solves) lowers the number for the
//! analyses run on its own thread.

use std::cell::Cell;

thread_local! {
    static LIMIT: Cell<usize> = const { Cell::new(usize::MAX) };
}

/// Threads an analysis started on this thread may use: the machine's
/// cores, at most `cap`, and never more than this thread's limit.
pub fn threads_for(cap: usize) -> usize {
    let cores = std::thread::available_parallelism().map_or(1, std::num::NonZero::get);
    cores.min(cap).min(LIMIT.with(Cell::get)).max(1)
}

/// Run `f` with analyses on this thread limited to `threads` threads
/// (1: all on this thread); the limit before is restored after.
pub fn with_thread_limit<R>(threads: usize, f: impl FnOnce() -> R) -> R {
    let before = LIMIT.with(|l| l.replace(threads.max(1)));
    let out = f();
    LIMIT.with(|l| l.set(before));
    out
}

/// The limit of this thread, for a long-lived thread that should keep it
/// for all it runs (the app's solve worker): analyses started on it use at
/// most `threads`.
pub fn set_thread_limit(threads: usize) {
    LIMIT.with(|l| l.set(threads.max(1)));
}

#[cfg(test)]
mod tests {
    use super::*;

    // The limit holds inside and is restored after; it never goes below one
    // thread; and another thread keeps its own.
    #[test]
    fn the_limit_is_per_thread_and_restored() {
        let free = threads_for(4);
        assert!((1..=4).contains(&free));
        assert_eq!(with_thread_limit(1, || threads_for(4)), 1);
        assert_eq!(with_thread_limit(0, || threads_for(4)), 1);
        assert_eq!(threads_for(4), free);
        set_thread_limit(1);
        assert_eq!(threads_for(4), 1);
        assert_eq!(std::thread::spawn(|| threads_for(4)).join().unwrap(), free);
        set_thread_limit(usize::MAX);
    }
}

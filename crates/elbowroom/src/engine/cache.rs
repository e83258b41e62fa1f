//! Finished results keyed by their inputs, shared as `Arc`s.

use super::requests::{JobKey, Output};
use std::collections::{HashMap, VecDeque};
use std::sync::{Arc, Mutex};

/// A bounded map from inputs to results; the oldest entries go first when full.
pub struct Cache {
    inner: Mutex<Inner>,
    capacity: usize,
}

#[derive(Default)]
struct Inner {
    map: HashMap<JobKey, Arc<Output>>,
    order: VecDeque<JobKey>,
    hits: u64,
}

impl Cache {
    /// A cache holding at most `capacity` results.
    pub fn new(capacity: usize) -> Self {
        Cache {
            inner: Mutex::new(Inner::default()),
            capacity: capacity.max(1),
        }
    }

    /// The result for `key`, if it was computed before.
    pub fn get(&self, key: &JobKey) -> Option<Arc<Output>> {
        let mut inner = self.inner.lock().unwrap_or_else(|e| e.into_inner());
        let found = inner.map.get(key).cloned();
        if found.is_some() {
            inner.hits += 1;
        }
        found
    }

    /// Remembers a result.
    pub fn insert(&self, key: JobKey, value: Arc<Output>) {
        let mut inner = self.inner.lock().unwrap_or_else(|e| e.into_inner());
        if inner.map.insert(key.clone(), value).is_none() {
            inner.order.push_back(key);
        }
        while inner.order.len() > self.capacity {
            if let Some(old) = inner.order.pop_front() {
                inner.map.remove(&old);
            }
        }
    }

    /// How many lookups found a result.
    pub fn hits(&self) -> u64 {
        self.inner.lock().unwrap_or_else(|e| e.into_inner()).hits
    }

    /// How many results are held.
    pub fn len(&self) -> usize {
        self.inner
            .lock()
            .unwrap_or_else(|e| e.into_inner())
            .map
            .len()
    }

    /// Whether nothing is held.
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::math::Perm;

    fn key(k: usize) -> JobKey {
        JobKey::Schubert(Perm::identity(k))
    }

    #[test]
    fn oldest_results_leave_first() {
        let cache = Cache::new(2);
        for k in 1..=3 {
            cache.insert(key(k), Arc::new(Output::Text(format!("{k}"))));
        }
        assert!(cache.get(&key(1)).is_none());
        assert!(cache.get(&key(2)).is_some());
        assert!(cache.get(&key(3)).is_some());
        assert_eq!(cache.len(), 2);
        assert_eq!(cache.hits(), 2);
    }
}

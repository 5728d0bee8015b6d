;; A relu layer's element-wise work on the wasm backend's heap, four elements per
;; instruction, each the float32 operation of the tfjs-backend-wasm kernels it replaces
;; (see relu-kernels.ts), so the bits are theirs. Addresses are byte offsets into the
;; imported memory; matrices are row-major float32.
(module
  (import "tfjs" "memory" (memory 1))

  ;; pre = a + b (b added to every row) and post = relu(pre) = max(pre, 0), for a, pre,
  ;; post [rows, cols] and b [cols]; WebAssembly's max keeps NaN and orders −0 below +0,
  ;; as tfjs-backend-wasm's Relu does (measured: relu(−0) = +0, relu(NaN) = NaN).
  (func (export "biasRelu") (param $a i32) (param $b i32) (param $pre i32) (param $post i32) (param $rows i32) (param $cols i32)
    (local $r i32) (local $c i32) (local $wide i32) (local $row i32) (local $v v128) (local $s f32)
    (local.set $wide (i32.shl (i32.and (local.get $cols) (i32.const -4)) (i32.const 2)))
    (local.set $row (i32.shl (local.get $cols) (i32.const 2)))
    (block $rowsDone (loop $rows
      (br_if $rowsDone (i32.ge_u (local.get $r) (local.get $rows)))
      (local.set $c (i32.const 0))
      (block $wideDone (loop $vectors
        (br_if $wideDone (i32.ge_u (local.get $c) (local.get $wide)))
        (local.set $v (f32x4.add (v128.load (i32.add (local.get $a) (local.get $c))) (v128.load (i32.add (local.get $b) (local.get $c)))))
        (v128.store (i32.add (local.get $pre) (local.get $c)) (local.get $v))
        (v128.store (i32.add (local.get $post) (local.get $c)) (f32x4.max (local.get $v) (v128.const f32x4 0 0 0 0)))
        (local.set $c (i32.add (local.get $c) (i32.const 16)))
        (br $vectors)))
      (block $narrowDone (loop $scalars
        (br_if $narrowDone (i32.ge_u (local.get $c) (local.get $row)))
        (local.set $s (f32.add (f32.load (i32.add (local.get $a) (local.get $c))) (f32.load (i32.add (local.get $b) (local.get $c)))))
        (f32.store (i32.add (local.get $pre) (local.get $c)) (local.get $s))
        (f32.store (i32.add (local.get $post) (local.get $c)) (f32.max (local.get $s) (f32.const 0)))
        (local.set $c (i32.add (local.get $c) (i32.const 4)))
        (br $scalars)))
      (local.set $a (i32.add (local.get $a) (local.get $row)))
      (local.set $pre (i32.add (local.get $pre) (local.get $row)))
      (local.set $post (i32.add (local.get $post) (local.get $row)))
      (local.set $r (i32.add (local.get $r) (i32.const 1)))
      (br $rows))))

  ;; delta = g · step(pre) for n elements, step(p) = p if p is NaN, else (p > 0 ? 1 : 0).
  (func (export "reluBackward") (param $g i32) (param $pre i32) (param $delta i32) (param $n i32)
    (local $i i32) (local $wide i32) (local $end i32) (local $p v128) (local $s f32)
    (local.set $wide (i32.shl (i32.and (local.get $n) (i32.const -4)) (i32.const 2)))
    (local.set $end (i32.shl (local.get $n) (i32.const 2)))
    (block $wideDone (loop $vectors
      (br_if $wideDone (i32.ge_u (local.get $i) (local.get $wide)))
      (local.set $p (v128.load (i32.add (local.get $pre) (local.get $i))))
      (v128.store (i32.add (local.get $delta) (local.get $i))
        (f32x4.mul
          (v128.load (i32.add (local.get $g) (local.get $i)))
          (v128.bitselect
            (local.get $p)
            (v128.and (f32x4.gt (local.get $p) (v128.const f32x4 0 0 0 0)) (v128.const f32x4 1 1 1 1))
            (f32x4.ne (local.get $p) (local.get $p)))))
      (local.set $i (i32.add (local.get $i) (i32.const 16)))
      (br $vectors)))
    (block $narrowDone (loop $scalars
      (br_if $narrowDone (i32.ge_u (local.get $i) (local.get $end)))
      (local.set $s (f32.load (i32.add (local.get $pre) (local.get $i))))
      (f32.store (i32.add (local.get $delta) (local.get $i))
        (f32.mul
          (f32.load (i32.add (local.get $g) (local.get $i)))
          (select (local.get $s)
            (select (f32.const 1) (f32.const 0) (f32.gt (local.get $s) (f32.const 0)))
            (f32.ne (local.get $s) (local.get $s)))))
      (local.set $i (i32.add (local.get $i) (i32.const 4)))
      (br $scalars))))
)

module colsheet

go 1.24.0

require (
	github.com/Knetic/govaluate v3.0.0+incompatible
	github.com/yuin/goldmark v1.8.7
	gopkg.in/yaml.v3 v3.0.1
)

require gonum.org/v1/gonum v0.17.0

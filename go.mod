module qbridge

go 1.26.8

require (
	github.com/ALTree/bigfloat v0.0.0-20220102081255-38c8b72a9924
	github.com/spf13/cobra v1.10.2
	github.com/spf13/pflag v1.0.9
	gonum.org/v1/gonum v0.17.0
)

require github.com/inconshreveable/mousetrap v1.1.0 // indirect
